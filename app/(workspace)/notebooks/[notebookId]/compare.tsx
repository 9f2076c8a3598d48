import { CompareScreen } from '@/features/notebooks';

export default CompareScreen;
