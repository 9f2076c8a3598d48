import { NotebookScreen } from '@/features/notebooks';

export default NotebookScreen;
