import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode, type Ref } from 'react';
import { Pressable, StyleSheet, View, useWindowDimensions } from 'react-native';
import type { Design } from '@/shared/design';
import { changedPaths } from '@/shared/design-diff';
import { versionMessageSchema, type Notebook, type Version } from '@/shared/notebooks';
import { pinLabel, pinnedResults, type Pin, type PinnedResult } from '@/shared/reviews';
import { can, roleLabels } from '@/shared/teams';
import { ApiError } from '@/features/api';
import { ReviewSheet, ReviewSidePanel, useVersionReviewQuery, type ReviewFocus, type ReviewPanelProps } from '@/features/reviews';
import { SheetButton } from '@/features/sheets';
import { Button, Card, Text, colors, minTouch, radius, space } from '@/features/ui';
import {
  draftFromDesign,
  FieldMarksProvider,
  formToDesign,
  resultTarget,
  Workbench,
  type Draft,
  type FieldMarks,
  type FormResult,
} from '@/features/workbench';
import {
  clearEdits,
  freshEdits,
  loadEdits,
  notebookDraftKey,
  notesAreNew,
  saveEdits,
  startFromNotes,
  type StoredEdits,
} from '../draft-store';
import { formatWhen, withArticle } from '../format';
import { useSaveVersionMutation, useVersionQuery, VersionConflict } from '../queries';
import { reapplyEdits } from '../rebase';
import { ConflictCard } from './conflict-card';
import { MarkdownView } from './markdown-view';
import { SaveCard } from './save-card';

type Props = {
  design: Notebook;
  version: Version;
  latest: Version;
  userId: string;
  /** Remount the workbench from what is now in storage (after a rebase or a discard). */
  onRestart: (note?: string) => void;
  rebaseNote: string | null;
  /** The notebook's own header, when it should scroll away with the editor (phones). */
  top?: ReactNode;
};

type Panel = 'save' | 'notes' | 'review';

/** The review is a side panel from this width up; a sheet over the page below it. */
const SIDE_PANEL_MIN_WIDTH = 1024;

/** The target a marker stands for: a field path, or `result:<kind>` (see field-marks.tsx). */
function pinTarget(pin: Pin): string | null {
  if (pin.kind === 'field') return pin.path;
  if (pin.kind === 'result') return resultTarget(pin.result);
  return null;
}

/** One button of the compact bar: opens or closes its card right under the bar. */
function PanelToggle({
  label,
  open,
  onPress,
  testID,
  buttonRef,
}: {
  label: string;
  open: boolean;
  onPress: () => void;
  testID: string;
  buttonRef?: Ref<View>;
}) {
  return (
    <Pressable
      ref={buttonRef}
      role="button"
      aria-expanded={open}
      accessibilityLabel={label}
      onPress={onPress}
      testID={testID}
      style={({ pressed, hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
        styles.toggle,
        open && styles.toggleOpen,
        (pressed || hovered) && !open && styles.toggleHover,
        focused && styles.toggleFocused,
      ]}
    >
      <Text variant="small" weight="semibold" style={open ? styles.toggleOpenText : styles.toggleText}>
        {label} {open ? '▴' : '▾'}
      </Text>
    </Pressable>
  );
}

/** The workbench on one version, with the save flow for owners on the latest version. */
export function DesignTab({ design, version, latest, userId, onRestart, rebaseNote, top }: Props) {
  const router = useRouter();
  // `?thread=<id>` (the link in review e-mails) opens the review on that thread; `?review=1` opens it.
  const search = useLocalSearchParams<{ thread?: string; review?: string }>();
  const { width } = useWindowDimensions();
  const sidePanel = width >= SIDE_PANEL_MIN_WIDTH;
  const isLatest = version.number === latest.number;
  const editable = can(design.role, 'designs.edit') && isLatest && !design.archived;
  const key = notebookDraftKey(userId, design.id);

  // Read once per mount: the kept edits when there are any, else the version as saved.
  const [start] = useState<StoredEdits>(() => {
    const stored = editable ? loadEdits(key) : null;
    return stored ?? freshEdits(draftFromDesign(version.params), version.number);
  });
  // The editor comes first; the cards open from the bar. Kept text reopens its card, so it is seen.
  const [open, setOpen] = useState<ReadonlySet<Panel>>(() => {
    const panels = new Set<Panel>();
    if (editable && (start.notes !== '' || start.message !== '')) panels.add('save');
    if (search.thread || search.review === '1') panels.add('review');
    return panels;
  });
  const [reviewFocus, setReviewFocus] = useState<ReviewFocus | null>(() =>
    typeof search.thread === 'string' && search.thread !== '' ? { kind: 'thread', threadId: search.thread } : null,
  );
  const [askedField, setAskedField] = useState<{ path: string; nonce: number } | null>(null);
  const reviewButton = useRef<View>(null);
  const review = useVersionReviewQuery(design.id, version.number);
  const openThreads = useMemo(() => (review.data?.threads ?? []).filter((t) => t.status === 'open'), [review.data]);
  const canWrite = can(design.role, 'designs.comment');
  const range = version.params.range;
  const readoutNm = Math.round(((range.startNm + range.endNm) / 2) * 10) / 10;
  const toggle = (panel: Panel) =>
    setOpen((current) => {
      const next = new Set(current);
      if (!next.delete(panel)) next.add(panel);
      return next;
    });
  const [notes, setNotes] = useState(start.notes);
  const [message, setMessage] = useState(start.message);
  const [result, setResult] = useState<FormResult | null>(null);
  const [conflict, setConflict] = useState<Version | null>(null);
  const [messageError, setMessageError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const save = useSaveVersionMutation(design.id);
  const draftRef = useRef<Draft>(start.draft);
  const textRef = useRef({ notes, message });
  useEffect(() => {
    textRef.current = { notes, message };
  }, [notes, message]);

  const base = start.baseVersion;
  const stale = editable && base < latest.number;
  const shownConflict = conflict ?? (stale ? latest : null);
  const baseVersion = useVersionQuery(design.id, shownConflict ? base : null);

  const isDirty = useCallback(
    (draft: Draft, text: { notes: string; message: string }) => {
      if (base !== version.number) return true;
      const typed = formToDesign(draft.values);
      return !typed.ok || changedPaths(version.params, typed.design).length > 0 || text.notes !== '' || text.message.trim() !== '';
    },
    [base, version],
  );

  const persist = useCallback(
    (draft: Draft, text: { notes: string; message: string }) => {
      if (!editable) return;
      if (isDirty(draft, text)) saveEdits(key, { draft, baseVersion: base, ...text });
      else clearEdits(key);
    },
    [editable, isDirty, key, base],
  );

  const onDraftChange = useCallback(
    (draft: Draft) => {
      draftRef.current = draft;
      persist(draft, textRef.current);
    },
    [persist],
  );
  const initial = useCallback(() => start.draft, [start]);

  const changeNotes = (next: string) => {
    setNotes(next);
    persist(draftRef.current, { notes: next, message });
  };
  const changeMessage = (next: string) => {
    setMessage(next);
    setMessageError(null);
    persist(draftRef.current, { notes, message: next });
  };

  const mine = result?.ok ? result.design : null;
  const nothingChanged =
    mine !== null && base === version.number && changedPaths(version.params, mine).length === 0 && !notesAreNew(notes, version.notes);
  const blockedReason = !result
    ? 'Reading the design…'
    : !result.ok
      ? 'Some fields are refused; fix them in the editor before saving.'
      : nothingChanged
        ? 'Nothing has changed since this version yet.'
        : null;

  const submit = async (onTopOf?: Version) => {
    if (!mine) return;
    setFormError(null);
    const checked = versionMessageSchema.safeParse(message);
    if (!checked.success) {
      setMessageError(`The message ${checked.error.issues[0]?.message ?? 'is not valid'}`);
      return;
    }
    try {
      const saved = await save.mutateAsync({ baseVersion: onTopOf ? onTopOf.number : base, params: mine, notes, message: checked.data });
      clearEdits(key);
      setConflict(null);
      if (version.number !== saved.version.number) router.replace(`/notebooks/${design.id}` as Href);
    } catch (error) {
      if (error instanceof VersionConflict) {
        setConflict(error.latest);
      } else if (error instanceof ApiError) {
        setFormError(Object.keys(error.fields).length > 0 ? Object.entries(error.fields).map(([path, why]) => `${path} ${why}`).join('; ') : error.message);
      } else {
        setFormError('The version could not be saved. Your edits are kept in this browser; try again.');
      }
    }
  };

  // A candidate from the search becomes the next version whole; the edits it came from are
  // replaced by it (typed notes and message stay), so the new version opens as saved.
  const saveCandidate = async (candidate: Design, candidateMessage: string) => {
    try {
      const saved = await save.mutateAsync({ baseVersion: latest.number, params: candidate, notes: '', message: candidateMessage });
      const text = textRef.current;
      if (text.notes === '' && text.message === '') clearEdits(key);
      else saveEdits(key, { ...freshEdits(draftFromDesign(saved.version.params), saved.version.number), ...text });
      if (version.number !== saved.version.number) router.replace(`/notebooks/${design.id}` as Href);
    } catch (error) {
      if (error instanceof VersionConflict) throw new Error(`v${error.latest.number} was saved meanwhile; open it and search again.`);
      if (error instanceof ApiError) throw new Error(error.message);
      throw new Error('the version could not be saved; try again.');
    }
  };

  const reapply =
    shownConflict && baseVersion.data && mine
      ? () => {
          const rebased = reapplyEdits(baseVersion.data.params, mine, shownConflict.params);
          saveEdits(key, { draft: draftFromDesign(rebased.design), baseVersion: shownConflict.number, notes, message });
          onRestart(
            rebased.overridden.length > 0
              ? `Re-applied your changes on v${shownConflict.number}. Where both changed the same field yours won: ${rebased.overridden.map((o) => o.path).join(', ')}.`
              : `Re-applied your changes on v${shownConflict.number}. Check the figures, then save.`,
          );
        }
      : null;

  const discard = () => {
    clearEdits(key);
    onRestart();
  };

  const startFromThis = () => {
    if (loadEdits(key)) {
      setFormError('You have unsaved edits on the latest version. Save or drop them there first.');
      return;
    }
    saveEdits(key, { ...freshEdits(draftFromDesign(version.params), latest.number), message: `Back to v${version.number}` });
    router.push(`/notebooks/${design.id}` as Href);
  };

  const readOnlyWhy = !can(design.role, 'designs.edit')
    ? `You are ${withArticle(roleLabels[design.role].toLowerCase())} of this team: you can read, compare and clone this design, not change it.`
    : design.archived
      ? 'This design is archived; bring it back from the list to edit it.'
      : null;

  const closeReview = () => {
    setOpen((current) => {
      const next = new Set(current);
      next.delete('review');
      return next;
    });
    // The sheet gives the focus back by itself; the side panel is part of the page.
    if (sidePanel) setTimeout(() => (reviewButton.current as unknown as { focus?: () => void } | null)?.focus?.(), 0);
  };
  const openReview = (focus: ReviewFocus | null) => {
    setReviewFocus(focus);
    setOpen((current) => new Set(current).add('review'));
  };
  const showPin = (pin: Pin) => {
    if (pin.kind !== 'field') return;
    // On a phone or tablet the sheet covers the field: close it first, then show the field.
    if (!sidePanel) closeReview();
    setTimeout(() => setAskedField({ path: pin.path, nonce: Date.now() }), sidePanel ? 0 : 150);
  };
  const marks = useMemo<FieldMarks>(() => {
    const counts = new Map<string, number>();
    for (const thread of openThreads) {
      const target = pinTarget(thread.pin);
      if (target) counts.set(target, (counts.get(target) ?? 0) + 1);
    }
    return {
      countFor: (target) => counts.get(target) ?? 0,
      open: (target) => {
        const thread = openThreads.find((t) => pinTarget(t.pin) === target);
        if (thread) return openReview({ kind: 'thread', threadId: thread.id });
        if (!canWrite) return openReview(null);
        const result = target.startsWith('result:') ? (target.slice('result:'.length) as PinnedResult) : null;
        const pin: Pin =
          result && (pinnedResults as readonly string[]).includes(result)
            ? { kind: 'result', result, wavelengthNm: readoutNm }
            : { kind: 'field', path: target };
        openReview({ kind: 'new', pin });
      },
      highlighted: askedField,
    };
  }, [openThreads, canWrite, readoutNm, askedField]);
  const reviewProps: ReviewPanelProps = {
    design: { id: design.id, teamId: design.teamId, role: design.role },
    version: version.number,
    userId,
    focus: reviewFocus,
    onFocus: setReviewFocus,
    onShowPin: showPin,
    onClose: closeReview,
    defaultWavelengthNm: readoutNm,
  };

  const header = (
    <View style={styles.header}>
      {top}
      <View style={styles.versionLine} testID="version-line">
        <Text weight="semibold">
          v{version.number} of {latest.number}
          {isLatest ? ' (latest)' : ''}
          {design.baselineVersion === version.number ? ' · team baseline' : ''}
        </Text>
        <Text variant="small" tone="muted">
          “{version.message}” · {version.author?.displayName ?? 'Former member'} · {formatWhen(version.createdAt)}
        </Text>
      </View>
      {readOnlyWhy ? (
        <Text variant="small" tone="muted" testID="read-only-note">
          {readOnlyWhy}
        </Text>
      ) : null}
      {!isLatest ? (
        <Card testID="older-version">
          <Text>This is an older version; it is shown read-only.</Text>
          <View style={styles.actions}>
            <Button kind="secondary" label={`Open the latest (v${latest.number})`} onPress={() => router.push(`/notebooks/${design.id}` as Href)} testID="open-latest" />
            {can(design.role, 'designs.edit') && !design.archived ? (
              <Button kind="quiet" label={`Start v${latest.number + 1} from this version`} onPress={startFromThis} testID="start-from-version" />
            ) : null}
          </View>
          {formError && !editable ? (
            <Text role="alert" tone="danger">
              {formError}
            </Text>
          ) : null}
        </Card>
      ) : null}
      {rebaseNote && editable ? (
        <Text role="status" tone="ok" weight="semibold" testID="rebase-note">
          {rebaseNote}
        </Text>
      ) : null}
      {editable && shownConflict ? (
        <ConflictCard
          latest={shownConflict}
          baseVersion={base}
          mine={mine}
          myNotes={notes}
          busy={save.isPending}
          onReapply={reapply}
          onSaveOnTop={() => void submit(shownConflict)}
          onDiscard={discard}
        />
      ) : null}
      <View role="group" aria-label={`Version ${version.number}: save, notes, review and design sheet`} style={styles.bar} testID="design-bar">
        {editable ? <PanelToggle label="Save version" open={open.has('save')} onPress={() => toggle('save')} testID="bar-save" /> : null}
        <PanelToggle label="Notes" open={open.has('notes')} onPress={() => toggle('notes')} testID="bar-notes" />
        <PanelToggle label="Review" open={open.has('review')} onPress={() => toggle('review')} testID="bar-review" buttonRef={reviewButton} />
        {/* With the save card closed, say that there is something to save. */}
        {editable && !open.has('save') && !shownConflict && blockedReason === null ? (
          <Text variant="small" tone="warning" weight="semibold" style={styles.unsaved} testID="unsaved-note">
            Unsaved changes
          </Text>
        ) : null}
        <SheetButton target={{ kind: 'version', designId: design.id, version: version.number, title: design.title }} />
      </View>
      {editable && open.has('save') ? (
        <SaveCard
          message={message}
          notes={notes}
          onChangeMessage={changeMessage}
          onChangeNotes={changeNotes}
          earlier={{ number: version.number, notes: version.notes }}
          onStartFromEarlier={() => changeNotes(startFromNotes(notes, version.notes))}
          messageError={messageError}
          formError={formError}
          blockedReason={shownConflict ? 'Choose how to go on with the newer version above first.' : blockedReason}
          nextNumber={(shownConflict?.number ?? latest.number) + 1}
          openThreads={openThreads.map((thread) => pinLabel(thread.pin))}
          busy={save.isPending}
          onSave={() => void submit()}
        />
      ) : null}
      {open.has('notes') ? (
        <Card title={`Notes of v${version.number}`} testID="notes-card">
          <MarkdownView source={version.notes} testID="notes" />
        </Card>
      ) : null}
      {sidePanel ? null : <ReviewSheet {...reviewProps} visible={open.has('review')} />}
    </View>
  );

  return (
    <FieldMarksProvider value={marks}>
      <Workbench
        key={`${design.id}:${version.number}`}
        initial={initial}
        onDraftChange={onDraftChange}
        onResultChange={setResult}
        header={header}
        readOnly={!editable}
        onSaveCandidate={editable ? saveCandidate : undefined}
        curveLibrary={{ teamId: design.teamId, canManage: can(design.role, 'curves.manage') }}
        aside={sidePanel && open.has('review') ? <ReviewSidePanel {...reviewProps} /> : null}
      />
    </FieldMarksProvider>
  );
}

const styles = StyleSheet.create({
  header: { gap: space.md },
  versionLine: { gap: space.xxs, borderLeftWidth: 3, borderLeftColor: colors.accent, paddingLeft: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  bar: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  unsaved: { paddingHorizontal: space.xs },
  toggle: {
    minHeight: minTouch,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.primary,
    backgroundColor: colors.surface,
    justifyContent: 'center',
  },
  toggleOpen: { backgroundColor: colors.primary },
  toggleHover: { backgroundColor: colors.surfaceSunken },
  toggleFocused: { borderColor: colors.focus, borderWidth: 2 },
  toggleText: { color: colors.primary },
  toggleOpenText: { color: colors.onPrimary },
});
