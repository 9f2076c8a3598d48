import { memo } from 'react';
import { StyleSheet, ScrollView, View } from 'react-native';
import { Text, space } from '@/features/ui';
import { wavelengthLabel } from '../image-quality-words';
import type { Spot, TraceReport, TracedWavelength } from '../types';
import { SpotDiagram } from './spot-diagram';
import { stripSnap } from './strip-snap';

type Props = { report: TraceReport; width: number; strip: boolean };

/** Top, centre, bottom: the slit's ends above and below its centre, as on the image plane. */
const HEIGHT_ORDER: readonly Spot['role'][] = ['top', 'centre', 'bottom'];
const GAP = space.md;
const MAX_SIZE = 150;

function apertureFor(report: TraceReport, spot: Spot) {
  // A spectrograph's detector has no slit: a pixel drawn about the spot shows the sampling; a
  // monochromator's exit slit stays where it is, at x = 0.
  return report.mode === 'spectrograph' && report.pixel
    ? { centreXMm: spot.centroidMm.x, widthMm: report.pixel.widthMm, label: 'One pixel' }
    : { centreXMm: 0, widthMm: report.exitSlit.widthMm, label: 'The exit slit' };
}

/** A monochromator that also names a detector: one pixel marked above the spot, for scale. */
function pixelMarkFor(report: TraceReport): number | null {
  return report.mode === 'monochromator' && report.pixel ? report.pixel.widthMm : null;
}

function Column({ report, w, size, snap }: { report: TraceReport; w: TracedWavelength; size: number; snap?: boolean }) {
  const spots = HEIGHT_ORDER.map((role) => w.spots.find((s) => s.role === role)).filter((s): s is Spot => s !== undefined);
  return (
    <View style={[styles.column, { width: size }, snap && stripSnap.item]} role="group" aria-label={wavelengthLabel(w)} testID={`trace-spots-${w.role}`}>
      <Text variant="small" weight="semibold">
        {wavelengthLabel(w)}
      </Text>
      {w.reachable ? (
        spots.map((spot) => (
          <SpotDiagram
            key={spot.role}
            wavelength={w}
            spot={spot}
            aperture={apertureFor(report, spot)}
            pixelMm={pixelMarkFor(report)}
            sizePx={size}
            testID={`trace-spot-${w.role}-${spot.role}`}
          />
        ))
      ) : (
        <Text variant="small" tone="muted">
          Out of the mount’s reach.
        </Text>
      )}
    </View>
  );
}

/**
 * The spot diagrams, one column per wavelength (shorter to the left, as along the dispersion) with
 * the slit's top, centre and bottom stacked as on the image plane. Phones swipe a strip that stops
 * at each column; wider screens fit the columns side by side. Memoised: the card's status line
 * changing as a trace starts must not redraw every spot.
 */
export const SpotStrip = memo(function SpotStrip({ report, width, strip }: Props) {
  const columns = [...report.wavelengths].sort((a, b) => a.wavelengthNm - b.wavelengthNm);
  if (strip) {
    // About two columns and a glimpse of the third, so the strip invites a swipe.
    const size = Math.min(MAX_SIZE, Math.floor((width - 2 * GAP) / 2.3));
    return (
      <ScrollView
        horizontal
        snapToInterval={size + GAP}
        decelerationRate="fast"
        showsHorizontalScrollIndicator
        style={stripSnap.strip}
        // A keyboard reaches the strip and scrolls it with the arrow keys (WCAG 2.1.1).
        focusable
        role="group"
        aria-label="Spot diagrams by wavelength, scroll sideways for more"
        contentContainerStyle={styles.row}
        testID="trace-spot-strip"
      >
        {columns.map((w) => (
          <Column key={`${w.role}-${w.wavelengthNm}`} report={report} w={w} size={size} snap />
        ))}
      </ScrollView>
    );
  }
  const perRow = Math.max(1, columns.length);
  const size = Math.min(MAX_SIZE, Math.floor((width - (perRow - 1) * GAP) / perRow));
  return (
    <View style={[styles.row, styles.wrap]} testID="trace-spot-grid">
      {columns.map((w) => (
        <Column key={`${w.role}-${w.wavelengthNm}`} report={report} w={w} size={Math.max(90, size)} />
      ))}
    </View>
  );
});

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: GAP },
  wrap: { flexWrap: 'wrap' },
  column: { gap: space.xs },
});
