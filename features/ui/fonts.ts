import { fonts } from './theme';

/** The TTF files shipped in assets/fonts (OFL licences beside them), keyed by family name. */
export const fontAssets = {
  [fonts.regular]: require('../../assets/fonts/Inter_400Regular.ttf'),
  [fonts.semibold]: require('../../assets/fonts/Inter_600SemiBold.ttf'),
  [fonts.bold]: require('../../assets/fonts/Inter_700Bold.ttf'),
  [fonts.mono]: require('../../assets/fonts/IBMPlexMono_400Regular.ttf'),
  [fonts.monoMedium]: require('../../assets/fonts/IBMPlexMono_500Medium.ttf'),
} as const;
