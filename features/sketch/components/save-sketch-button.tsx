import { useState } from 'react';
import { Button, saveTextFile } from '@/features/ui';
import type { Design } from '@/shared/design';
import { SKETCH_FILE_NAME, sketchSvgDocument } from '../svg-file';

/** Builds the standalone SVG of `design`'s sketch and saves it (a download on the web). */
export async function saveSketchSvg(design: Design, options: { settingNm?: number } = {}): Promise<boolean> {
  return saveTextFile(sketchSvgDocument(design, options), SKETCH_FILE_NAME, 'image/svg+xml');
}

type Props = { design: Design; settingNm?: number | null; testID?: string };

export function SaveSketchButton({ design, settingNm, testID = 'save-sketch' }: Props) {
  const [busy, setBusy] = useState(false);
  const save = () => {
    setBusy(true);
    saveSketchSvg(design, { settingNm: settingNm ?? undefined })
      .catch(() => false)
      .finally(() => setBusy(false));
  };
  return (
    <Button
      label="Save sketch as SVG"
      kind="secondary"
      onPress={save}
      disabled={busy}
      // The visible words start the name (WCAG 2.2 SC 2.5.3, label in name); the file name follows.
      accessibilityLabel={`Save sketch as SVG: ${SKETCH_FILE_NAME}`}
      testID={testID}
    />
  );
}
