import type { Design } from '@/shared/design';

export type CandidateSearchPanelProps = {
  /** The design shown in the workbench: its range, source, detector and requirements are the search's input. */
  design: Design;
  /** Loads a candidate into the editor ("open in the workbench"). */
  onOpen: (design: Design) => void;
  /** Saves a candidate as a new version of the open notebook; absent where there is none or no right to save. */
  onSave?: (design: Design, message: string) => Promise<void>;
  readOnly?: boolean;
};

/** The candidate search: being built for issue 15 (the search UI replaces this file). */
export function CandidateSearchPanel(_props: CandidateSearchPanelProps) {
  return null;
}
