import { demoDesigns } from '@/shared/demo-designs';
import type { Design } from '@/shared/design';

/** Starting points for a new design, offered on the scratch workbench. */
export type Preset = { id: string; title: string; summary: string; design: Design };

export const presets: readonly Preset[] = [
  {
    id: 'visible-scanner',
    title: 'Compact visible scanner',
    summary: '0.15 m Czerny–Turner, 1200/mm, 380–780 nm with a tungsten lamp',
    design: demoDesigns.visibleScanner,
  },
  {
    id: 'uv-excitation',
    title: 'UV excitation monochromator',
    summary: '0.25 m Czerny–Turner, 2400/mm, 200–450 nm from a xenon arc, wide slits for throughput',
    design: demoDesigns.uvExcitation,
  },
  {
    id: 'nir-spectrograph',
    title: 'Near-IR line-detector spectrograph',
    summary: 'Czerny–Turner with a longer camera, 300/mm, 900–1700 nm on a 512-pixel array',
    design: demoDesigns.nirSpectrograph,
  },
];

export const defaultPreset = presets[0] as Preset;
