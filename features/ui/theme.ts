/**
 * Blazebook's own look: warm drafting paper, slate-blue ink, a copper accent for what the user
 * is acting on. Numbers are set in a monospaced face with tabular figures so columns line up.
 */
export const colors = {
  paper: '#F4F1EA',
  surface: '#FFFFFF',
  surfaceSunken: '#EAE5DA',
  ink: '#1D2733',
  inkMuted: '#566170',
  inkFaint: '#8A93A0',
  line: '#D6CFC1',
  primary: '#1F4E5F',
  primaryPressed: '#163A47',
  onPrimary: '#FFFFFF',
  // 4.96:1 on the compare table's changed-cell tint #FFF2E6, 4.5:1 needed (WCAG 2.2, 1.4.3;
  // computed with its relative-luminance formula). #B65A1E gave 4.27.
  accent: '#A5531B',
  focus: '#2F7FA8',
  danger: '#A3262A',
  dangerSoft: '#FBE9E7',
  warning: '#7A5300',
  warningSoft: '#FFF2D1',
  ok: '#2E6B3C',
  okSoft: '#E4F1E4',
} as const;

/** Font family names as registered with expo-font (the keys of `fontAssets`). */
export const fonts = {
  regular: 'Inter-Regular',
  semibold: 'Inter-SemiBold',
  bold: 'Inter-Bold',
  mono: 'PlexMono-Regular',
  monoMedium: 'PlexMono-Medium',
} as const;

/** A type scale in px, about 1.2 apart, big enough to read on a phone at arm's length. */
export const type = {
  caption: { fontSize: 12, lineHeight: 16 },
  small: { fontSize: 14, lineHeight: 20 },
  body: { fontSize: 16, lineHeight: 24 },
  lead: { fontSize: 19, lineHeight: 28 },
  title: { fontSize: 23, lineHeight: 30 },
  headline: { fontSize: 28, lineHeight: 36 },
  display: { fontSize: 34, lineHeight: 42 },
} as const;

export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

export const radius = { sm: 4, md: 8, lg: 12 } as const;

/** Touch targets at least this tall (common practice for phones: about 44–48 px). */
export const minTouch = 44;

/** Breakpoints on the window width, in px. Phone below `tablet`, wide from `wide` up. */
export const breakpoints = { tablet: 600, wide: 1100 } as const;

/** Single-column content is centred and no wider than this, so phone-first screens stay legible. */
export const maxContentWidth = 720;

export type Layout = 'phone' | 'tablet' | 'wide';

export function layoutForWidth(widthPx: number): Layout {
  if (widthPx >= breakpoints.wide) return 'wide';
  if (widthPx >= breakpoints.tablet) return 'tablet';
  return 'phone';
}
