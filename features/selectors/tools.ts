/**
 * The three calculators of the selectors screen, by the names people read and the ids the URL
 * carries (`/selectors?tool=prism`), so a link opens one directly. Pure: no React.
 */

export const SELECTOR_TOOLS = ['thin-film', 'glass', 'prism'] as const;
export type SelectorTool = (typeof SELECTOR_TOOLS)[number];

export const DEFAULT_TOOL: SelectorTool = 'thin-film';

export interface ToolDescription {
  /** Short enough for three segments side by side on a 390 px phone. */
  label: string;
  /** The calculator's heading. */
  title: string;
  /** What it is, naming the trade term. */
  blurb: string;
}

export const TOOL_DESCRIPTIONS: Record<SelectorTool, ToolDescription> = {
  'thin-film': {
    label: 'Thin-film filter',
    title: 'Thin-film filter',
    blurb:
      'An interference (Fabry–Pérot) filter: a spacer between two mirrors passes a narrow band at a fixed wavelength, ' +
      'tuned a little shorter by tilting it.',
  },
  glass: {
    label: 'Glass stack',
    title: 'Glass stack',
    blurb:
      'Coloured-glass absorption filters, one or several in a stack: cheap, broad edges; thicker or stacked glass ' +
      'sharpens the edge and lowers the peak.',
  },
  prism: {
    label: 'Prism',
    title: 'Prism',
    blurb:
      'A prism monochromator at minimum deviation: no overlapping orders, but its dispersion changes strongly across ' +
      'the range.',
  },
};

/** The tool a `tool` query parameter names; the default for a missing or unknown one. */
export function toolFromParam(param: string | string[] | undefined): SelectorTool {
  const value = Array.isArray(param) ? param[0] : param;
  return (SELECTOR_TOOLS as readonly string[]).includes(value ?? '') ? (value as SelectorTool) : DEFAULT_TOOL;
}
