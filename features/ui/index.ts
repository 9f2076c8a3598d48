export { Button } from './components/button';
export { DisclosureButton } from './components/disclosure-button';
export { Card } from './components/card';
export { Heading } from './components/heading';
export { RadioGroup } from './components/radio-group';
export { SwitchRow } from './components/switch-row';
export type { RadioOption } from './components/radio-group';
export { Screen } from './components/screen';
export { Text } from './components/text';
export { TextField } from './components/text-field';
export { Wordmark } from './components/wordmark';
export { copyText } from './clipboard';
export { documentTitle } from './document-title-text';
export { useDocumentTitle } from './document-title';
export { fontAssets } from './fonts';
export { installFocusRing } from './focus-ring';
export { printHidden } from './print';
export { installPrintStyles } from './print-styles';
export { installPlainShaping } from './text-shaping';
export { downloadBlob, saveTextFile } from './save-text-file';
export { useLayout } from './theme-context';
export {
  breakpoints,
  colors,
  fonts,
  layoutForWidth,
  maxContentWidth,
  minTouch,
  radius,
  space,
  type,
} from './theme';
export type { Layout } from './theme';
