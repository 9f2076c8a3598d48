import { NotebooksHomeScreen } from '@/features/notebooks';

export default NotebooksHomeScreen;
