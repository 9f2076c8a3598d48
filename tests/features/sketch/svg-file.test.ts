import { describe, expect, it } from 'vitest';
import { SKETCH_FILE_NAME, escapeXml, sketchSvgDocument } from '../../../features/sketch/svg-file';
import { exampleDesign, type Design } from '../../../shared/design';

/**
 * A strict little XML well-formedness check (no parser is a declared dependency): every tag
 * closes in order, attributes are quoted, text holds no raw `<` or stray `&`. Returns the
 * element names in document order.
 */
function parseElements(xml: string): string[] {
  const names: string[] = [];
  const open: string[] = [];
  const body = xml.replace(/^<\?xml[^?]*\?>\s*/, '');
  const token = /<(\/?)([A-Za-z][\w:-]*)((?:\s+[\w:-]+="[^"<]*")*)\s*(\/?)>|([^<]+)/gy;
  let match: RegExpExecArray | null;
  let consumed = 0;
  while ((match = token.exec(body)) !== null) {
    consumed = token.lastIndex;
    const [, closing, name, , selfClosing, text] = match;
    if (text !== undefined) {
      if (/&(?!(amp|lt|gt|quot|apos);)/.test(text)) throw new Error(`bad entity in text: ${text}`);
      if (open.length === 0 && text.trim() !== '') throw new Error('text outside the root element');
      continue;
    }
    if (closing) {
      if (open.pop() !== name) throw new Error(`</${name}> closes the wrong element`);
    } else {
      if (open.length === 0 && names.length > 0) throw new Error('more than one root element');
      names.push(name as string);
      if (!selfClosing) open.push(name as string);
    }
  }
  if (consumed !== body.length)
    throw new Error(`unparsed input at ${consumed}: ${body.slice(consumed, consumed + 40)}`);
  if (open.length > 0) throw new Error(`unclosed <${open.join('>, <')}>`);
  return names;
}

describe('sketchSvgDocument', () => {
  const svg = sketchSvgDocument(exampleDesign);
  const elements = parseElements(svg);

  it('is a well-formed SVG document with an svg root in the SVG namespace', () => {
    expect(svg.startsWith('<?xml version="1.0" encoding="UTF-8"?>')).toBe(true);
    expect(elements[0]).toBe('svg');
    expect(svg).toMatch(/<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    expect(elements.filter((name) => name === 'svg')).toHaveLength(1);
  });

  it('carries a title naming the mount, for readers and file browsers', () => {
    expect(elements).toContain('title');
    expect(svg).toMatch(/<title>Czerny–Turner layout to scale/);
  });

  it('draws the components, the rays and a scale bar labelled in millimetres', () => {
    for (const id of [
      'sketch-grating',
      'sketch-collimator',
      'sketch-camera',
      'sketch-entrance-slit',
      'sketch-detector',
      'sketch-scale-bar',
      'sketch-ray-centre',
    ]) {
      expect(svg).toContain(`id="${id}"`);
    }
    const bar = /id="sketch-scale-bar" data-length-mm="(\d+)"/.exec(svg);
    expect(bar).not.toBeNull();
    expect(svg).toContain(`>${bar?.[1]}\u00A0mm</text>`);
    expect(elements.filter((name) => name === 'path').length).toBeGreaterThan(10);
  });

  it('stays well-formed when a wavelength is unreachable, and says so in its description', () => {
    const far: Design = { ...exampleDesign, range: { startNm: 500, endNm: 2500 } };
    const text = sketchSvgDocument(far, { settingNm: 600 });
    expect(parseElements(text)[0]).toBe('svg');
    expect(text).toMatch(/<desc>[^<]*Not drawn: 2500\snm/);
  });

  it('escapes markup characters in text', () => {
    expect(escapeXml(`a<b & "c" 'd'>`)).toBe('a&lt;b &amp; &quot;c&quot; &apos;d&apos;&gt;');
  });

  it('is saved under a name of our own', () => {
    expect(SKETCH_FILE_NAME).toBe('blazebook-sketch.svg');
  });
});
