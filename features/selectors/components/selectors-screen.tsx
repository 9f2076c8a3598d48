import { useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Heading, RadioGroup, Screen, Text, space, useDocumentTitle, useLayout } from '@/features/ui';
import { GLASS_STACK_DEFAULTS, type GlassStackText } from '../glass-stack-form';
import { PRISM_DEFAULTS, type PrismText } from '../prism-form';
import { THIN_FILM_DEFAULTS, type ThinFilmText } from '../thin-film-form';
import { SELECTOR_TOOLS, TOOL_DESCRIPTIONS, toolFromParam, type SelectorTool } from '../tools';
import { GlassStackTool } from './glass-stack-tool';
import { PrismTool } from './prism-tool';
import { ThinFilmTool } from './thin-film-tool';

const TOOL_OPTIONS = SELECTOR_TOOLS.map((tool) => ({ value: tool, label: TOOL_DESCRIPTIONS[tool].label }));

/**
 * The simpler wavelength selectors as calculators: a thin-film (Fabry–Pérot) filter, a stack of
 * coloured-glass filters and a prism. The chosen one is the URL's `tool` (`/selectors?tool=prism`),
 * so a link opens it; each keeps its typed text while another is open.
 */
export function SelectorsScreen() {
  useDocumentTitle('Filters and prisms');
  const params = useLocalSearchParams<{ tool?: string }>();
  const tool = toolFromParam(params.tool);
  const router = useRouter();
  const layout = useLayout();
  const [thinFilm, setThinFilm] = useState<ThinFilmText>(THIN_FILM_DEFAULTS);
  const [glass, setGlass] = useState<GlassStackText>(GLASS_STACK_DEFAULTS);
  const [prism, setPrism] = useState<PrismText>(PRISM_DEFAULTS);
  const choose = (next: SelectorTool) => router.setParams({ tool: next });
  const description = TOOL_DESCRIPTIONS[tool];
  return (
    <Screen wide={layout === 'wide'}>
      <View style={styles.heading}>
        <Heading level={1}>Filters and prisms</Heading>
        <Text variant="small" tone="muted">
          Simpler wavelength selectors than a grating, worked out as you type. Values take units: “0.55 µm”, “2 cm”, “5°”.
        </Text>
      </View>
      <RadioGroup
        label="Calculator"
        look="segmented"
        options={TOOL_OPTIONS}
        value={tool}
        onChange={choose}
        testID="selector-tool"
      />
      <View style={styles.heading}>
        <Heading level={2} testID="selector-tool-title">
          {description.title}
        </Heading>
        <Text variant="small" tone="muted">
          {description.blurb}
        </Text>
      </View>
      {tool === 'thin-film' ? <ThinFilmTool text={thinFilm} onChange={setThinFilm} /> : null}
      {tool === 'glass' ? <GlassStackTool text={glass} onChange={setGlass} /> : null}
      {tool === 'prism' ? <PrismTool text={prism} onChange={setPrism} /> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  heading: { gap: space.xs },
});
