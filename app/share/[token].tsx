import { ShareScreen } from '@/features/notebooks';

export default ShareScreen;
