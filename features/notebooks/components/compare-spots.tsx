import { useMemo, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Design } from '@/shared/design';
import { formatQuantity } from '@/shared/format';
import type { TraceOptions } from '@/shared/trace';
import { SpotDiagram, useTrace, type TraceState } from '@/features/trace/ui';
import { Card, Text, space } from '@/features/ui';
import type { SpotWindow } from '@/features/trace/spot-figure';
import { centreWavelengthSpot, sharedSpotWindows, spotChangeWords, type ComparedSpot } from '../compare-spots';

/** The trace's defaults (rays, straight slit): the same figures the workbench's card shows first. */
const OPTIONS: TraceOptions = {};

type Side = { number: number; params: Design; when: 'before' | 'after' };

function pickedSpot(state: TraceState): ComparedSpot | null {
  return state.report ? centreWavelengthSpot(state.report) : null;
}

function SpotColumn({ side, state, sizePx, window }: { side: Side; state: TraceState; sizePx: number; window?: SpotWindow }) {
  const spot = pickedSpot(state);
  const testID = `compare-spot-v${side.number}`;
  const head = spot?.ok
    ? `v${side.number} (${side.when}), ${formatQuantity(spot.wavelength.wavelengthNm, 'nm', 5)}`
    : `v${side.number} (${side.when})`;
  let body: ReactNode;
  if (state.failure) body = <Text tone="danger">{`The trace could not run: ${state.failure}.`}</Text>;
  else if (!spot) body = <Text tone="muted">Tracing…</Text>;
  else if (!spot.ok) body = <Text tone="muted">{`No spot: ${spot.reason}.`}</Text>;
  else {
    const w = spot.wavelength;
    body = (
      <>
        <SpotDiagram wavelength={w} spot={spot.spot} aperture={spot.aperture} sizePx={sizePx} window={window} testID={testID} />
        <Text variant="small" testID={`${testID}-figures`}>
          {`Traced FWHM ${w.tracedFwhmNm === null ? 'none' : formatQuantity(w.tracedFwhmNm, 'nm', 3)} (slit-limited ${formatQuantity(w.slitLimitedFwhmNm, 'nm', 3)})`}
        </Text>
      </>
    );
  }
  return (
    <View style={styles.column}>
      <Text variant="small" weight="semibold">
        {head}
      </Text>
      {body}
    </View>
  );
}

/**
 * Both versions traced (off the UI thread, as the workbench's card traces) and their spots from
 * the middle of the entrance slit at the range centre side by side, each beside its exit slit to
 * scale, with the change in words.
 */
export function CompareSpots({ before, after, width }: { before: Side; after: Side; width: number }) {
  const a = useTrace(before.params, OPTIONS);
  const b = useTrace(after.params, OPTIONS);
  const sizePx = Math.max(120, Math.min(260, Math.floor((width - space.lg) / 2)));
  const spotA = useMemo(() => pickedSpot(a), [a]);
  const spotB = useMemo(() => pickedSpot(b), [b]);
  // Both at one scale once both are traced, so a sharper spot reads smaller, not magnified.
  const windows = useMemo(
    () => (spotA?.ok && spotB?.ok ? sharedSpotWindows([spotA, spotB], sizePx) : null),
    [spotA, spotB, sizePx],
  );
  return (
    <Card title="Spot diagrams at the centre wavelength" testID="compare-spots">
      <Text variant="small" tone="muted">
        The rays from the middle of each version’s entrance slit at the centre of its range, where they cross the image plane:
        across is the dispersion, up is along the slit. Both squares are drawn at one scale.
      </Text>
      <View style={styles.row}>
        <SpotColumn side={before} state={a} sizePx={sizePx} window={windows?.[0]} />
        <SpotColumn side={after} state={b} sizePx={sizePx} window={windows?.[1]} />
      </View>
      {spotA?.ok && spotB?.ok ? (
        <Text variant="small" weight="semibold" testID="compare-spots-change">
          {`From v${before.number} to v${after.number}: ${spotChangeWords(spotA.wavelength, spotB.wavelength)}.`}
        </Text>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  column: { gap: space.xs, minWidth: 0 },
});
