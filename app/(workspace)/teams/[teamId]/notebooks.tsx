import { NotebookListScreen } from '@/features/notebooks';

export default NotebookListScreen;
