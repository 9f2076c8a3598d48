// The sketch's drawing primitives, in pixels (see sketch-scene.ts).

export type TextWeight = 'regular' | 'semibold' | 'mono';

export type SketchShape =
  | {
      type: 'path';
      key: string;
      d: string;
      stroke: string;
      strokeWidth: number;
      dash?: string | null;
      fill?: string;
      opacity?: number;
      linecap?: 'round' | 'butt';
      testID?: string;
      /** Extra attributes for tests and tools (`data-<name>` on the web). */
      data?: Record<string, string>;
    }
  | {
      type: 'text';
      key: string;
      x: number;
      y: number;
      text: string;
      fontSize: number;
      anchor: 'start' | 'middle' | 'end';
      fill: string;
      weight: TextWeight;
    };

export interface SketchScene {
  widthPx: number;
  heightPx: number;
  pxPerMm: number;
  scaleBarMm: number;
  shapes: SketchShape[];
}

export interface SceneOptions {
  widthPx: number;
  /** Upper bound on the height; the drawing shrinks to fit (default: 1.1 × width, at most 560). */
  maxHeightPx?: number;
}

/** One step's drawing: paths in `shapes`, and `texts`, which the scene draws above every path. */
export interface SceneLayer {
  shapes: SketchShape[];
  texts: SketchShape[];
}
