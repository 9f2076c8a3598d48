import { describe, expect, it } from 'vitest';
import { DEFAULT_TOOL, SELECTOR_TOOLS, TOOL_DESCRIPTIONS, toolFromParam } from '../../../features/selectors/tools';

describe('the calculator named in the URL', () => {
  it.each(SELECTOR_TOOLS.map((tool) => [tool] as const))('opens %s when the link names it', (tool) => {
    expect(toolFromParam(tool)).toBe(tool);
  });

  it.each([[undefined], [''], ['grating'], [['prism', 'glass']]] as const)('falls back to the default for %j (the first of a repeated parameter wins)', (param) => {
    expect(toolFromParam(param as string | string[] | undefined)).toBe(Array.isArray(param) ? 'prism' : DEFAULT_TOOL);
  });

  it('gives every tool a label short enough for three segments on a 390 px phone', () => {
    // 14 px semibold Inter is about 8 px a character (common practice: 0.55–0.6 em), plus 24 px padding:
    // three segments must fit the 358 px between the screen's 16 px margins.
    const widthPx = SELECTOR_TOOLS.reduce((sum, tool) => sum + TOOL_DESCRIPTIONS[tool].label.length * 8 + 26, 0);
    expect(widthPx).toBeLessThanOrEqual(358);
  });
});
