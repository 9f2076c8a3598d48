import { Text } from 'react-native';

/** Placeholder while the calculators are built (issue 16). */
export function SelectorsScreen() {
  return <Text>Selectors</Text>;
}
