import { SelectorsScreen } from '@/features/selectors';

export default SelectorsScreen;
