export { OverlaySketch } from './components/overlay-sketch';
export { RaySketch, SceneSvg, type RaySketchProps } from './components/ray-sketch';
export { overlaySketchScenes } from './overlay';
export { SaveSketchButton, saveSketchSvg } from './components/save-sketch-button';
export {
  describeSketch,
  scaleBarLengthMm,
  sketchGeometry,
  type AngleArc,
  type PointMm,
  type RayRole,
  type SegmentMm,
  type SketchGeometry,
  type SketchOptic,
  type SketchOptions,
  type SketchRay,
  type SketchSlit,
  type UnreachableRay,
} from './geometry';
export { buildSketchScene, type SketchScene, type SketchShape } from './sketch-scene';
export { SKETCH_FILE_NAME, sketchSvgDocument, type SvgFileOptions } from './svg-file';
export {
  VISIBLE_MAX_NM,
  VISIBLE_MIN_NM,
  spectralBand,
  wavelengthStroke,
  type SpectralBand,
  type WavelengthStroke,
} from './wavelength-colour';
