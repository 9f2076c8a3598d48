import { NotFoundScreen } from '@/features/landing';

export default NotFoundScreen;
