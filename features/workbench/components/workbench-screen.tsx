import { StyleSheet, View } from 'react-native';
import { Heading, Text, space, useDocumentTitle } from '@/features/ui';
import { loadDraft, saveDraft } from '../draft';
import { Workbench } from './workbench';

const loadScratch = () => loadDraft();
const saveScratch = (draft: Parameters<typeof saveDraft>[0]) => void saveDraft(draft);

/** The scratch workbench: one design kept in this browser, no account needed. */
export function WorkbenchScreen() {
  useDocumentTitle('Workbench');
  return (
    <Workbench
      initial={loadScratch}
      onDraftChange={saveScratch}
      showPresets
      header={
        <View style={styles.heading}>
          <Heading level={1}>Workbench</Heading>
          <Text variant="small" tone="muted">
            Scratch design, kept in this browser as you type. Values take units: “0.5 m”, “1200/mm”, “25 um”.
          </Text>
        </View>
      }
    />
  );
}

const styles = StyleSheet.create({
  heading: { gap: space.xs },
});
