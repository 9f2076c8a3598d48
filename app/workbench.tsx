import { WorkbenchScreen } from '@/features/workbench';

export default WorkbenchScreen;
