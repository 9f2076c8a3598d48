import { useEffect, useMemo, useRef, useState } from 'react';
import { Modal, Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { Pin, Thread, ThreadStatus } from '@/shared/reviews';
import { can, type Role } from '@/shared/teams';
import { Button, Heading, RadioGroup, Text, colors, fonts, minTouch, radius, space, type } from '@/features/ui';
import { useMentionCandidatesQuery, useVersionReviewQuery } from '../thread-queries';
import { DecisionSection } from './decision-section';
import { NewRemarkForm } from './new-remark-form';
import { ThreadCard } from './thread-card';

/** What the panel is turned to: one thread (a marker, a link), or a new remark pinned somewhere. */
export type ReviewFocus = { kind: 'thread'; threadId: string } | { kind: 'new'; pin: Pin | null };

export type ReviewPanelProps = {
  design: { id: string; teamId: string; role: Role };
  version: number;
  userId: string;
  focus: ReviewFocus | null;
  onFocus: (focus: ReviewFocus | null) => void;
  /** A thread's pin label was tapped. */
  onShowPin: (pin: Pin) => void;
  onClose: () => void;
  /** The read-out wavelength offered for a remark pinned to a result. */
  defaultWavelengthNm: number;
};

/** Scrolls a thread into view where the platform can (web); native keeps the list's position. */
function scrollIntoView(node: unknown) {
  const element = node as { scrollIntoView?: (options: ScrollIntoViewOptions) => void } | null;
  element?.scrollIntoView?.({ block: 'nearest', behavior: 'smooth' });
}

function focusNode(node: unknown) {
  (node as { focus?: () => void } | null)?.focus?.();
}

/** Whether the focused element is inside `node` (on the web, where a view is a DOM node; never on native). */
function holdsFocus(node: unknown): boolean {
  const active = typeof document === 'undefined' ? null : document.activeElement;
  const within = (node as { contains?: (other: unknown) => boolean } | null)?.contains;
  return active !== null && typeof within === 'function' && within.call(node, active);
}

/** The review of one version: the decision part, then its threads and those carried from earlier versions. */
function ReviewContent({ design, version, userId, focus, onFocus, onShowPin, defaultWavelengthNm }: ReviewPanelProps) {
  const review = useVersionReviewQuery(design.id, version);
  const canWrite = can(design.role, 'designs.comment');
  const members = useMentionCandidatesQuery(design.teamId, canWrite);
  const [chosenFilter, setChosenFilter] = useState<{ status: ThreadStatus; forThread: string | null }>({ status: 'open', forThread: null });
  const threadNodes = useRef(new Map<string, View | null>());

  // A thread of an earlier version stops showing here once resolved (only open ones carry); one
  // resolved in this panel stays in its Resolved list, so the resolve can be seen and undone.
  const [lately, setLately] = useState<ReadonlyMap<string, Thread>>(new Map());
  const threads = useMemo(() => {
    const fetched = review.data?.threads ?? [];
    const known = new Set(fetched.map((t) => t.id));
    return [...fetched, ...[...lately.values()].filter((t) => !known.has(t.id) && t.status === 'resolved')];
  }, [review.data, lately]);
  const focusedThread = focus?.kind === 'thread' ? threads.find((t) => t.id === focus.threadId) : undefined;
  // A thread opened from a marker or a link is shown whatever the filter said (a resolved one
  // switches to the resolved list) until the filter is changed again.
  const filter = focusedThread && chosenFilter.forThread !== focusedThread.id ? focusedThread.status : chosenFilter.status;
  const setFilter = (status: ThreadStatus) => setChosenFilter({ status, forThread: focusedThread?.id ?? null });
  useEffect(() => {
    if (!focusedThread) return;
    const timer = setTimeout(() => scrollIntoView(threadNodes.current.get(focusedThread.id)), 50);
    return () => clearTimeout(timer);
  }, [focus, focusedThread?.id]); // eslint-disable-line react-hooks/exhaustive-deps

  const counts = useMemo(
    () => ({ open: threads.filter((t) => t.status === 'open').length, resolved: threads.filter((t) => t.status === 'resolved').length }),
    [threads],
  );
  const shown = threads.filter((t) => t.status === filter);
  const here = shown.filter((t) => t.carry.state === 'here');
  const carried = shown.filter((t) => t.carry.state !== 'here');

  const card = (thread: Thread) => (
    <ThreadCard
      key={thread.id}
      ref={(node) => {
        threadNodes.current.set(thread.id, node);
      }}
      thread={thread}
      focused={focusedThread?.id === thread.id}
      onShowPin={onShowPin}
      onStatusChanged={(changed) => setLately((map) => new Map(map).set(changed.id, changed))}
      designId={design.id}
      version={version}
      userId={userId}
      canWrite={canWrite}
      members={members.data ?? []}
    />
  );

  if (review.isPending) return <Text tone="muted">Loading the review…</Text>;
  if (review.isError) {
    return (
      <Text role="alert" tone="danger">
        The review could not be loaded: {review.error.message}
      </Text>
    );
  }
  return (
    <View style={styles.content}>
      <DecisionSection designId={design.id} version={version} role={design.role} userId={userId} review={review.data} />
      <View style={styles.section}>
        <Heading level={3}>Threads</Heading>
        {focus?.kind === 'new' && canWrite ? (
          <NewRemarkForm
            key={JSON.stringify(focus.pin)}
            designId={design.id}
            version={version}
            initialPin={focus.pin}
            defaultWavelengthNm={defaultWavelengthNm}
            members={members.data ?? []}
            userId={userId}
            onDone={(threadId) => {
              setFilter('open');
              onFocus({ kind: 'thread', threadId });
            }}
            onCancel={() => onFocus(null)}
          />
        ) : canWrite ? (
          <View style={styles.actions}>
            <Button kind="secondary" label="New remark" onPress={() => onFocus({ kind: 'new', pin: null })} testID="new-remark" />
          </View>
        ) : (
          <Text variant="small" tone="muted">
            Viewers read the threads; owners and reviewers write them.
          </Text>
        )}
        <RadioGroup
          label="Show threads"
          options={[
            { value: 'open', label: `Open (${counts.open})` },
            { value: 'resolved', label: `Resolved (${counts.resolved})` },
          ]}
          value={filter}
          onChange={setFilter}
          look="segmented"
          size="compact"
          testID="thread-filter"
        />
        {shown.length === 0 ? (
          <Text tone="muted" testID="threads-empty">
            {filter === 'open' ? 'No open threads on this version.' : 'No resolved threads on this version.'}
          </Text>
        ) : null}
        {here.length > 0 ? (
          <View style={styles.list} testID="threads-here">
            <Text variant="small" weight="semibold" tone="muted">
              On v{version}
            </Text>
            {here.map(card)}
          </View>
        ) : null}
        {carried.length > 0 ? (
          <View style={styles.list} testID="threads-carried">
            <Text variant="small" weight="semibold" tone="muted">
              From earlier versions
            </Text>
            {carried.map(card)}
          </View>
        ) : null}
      </View>
    </View>
  );
}

function CloseButton({ onPress, buttonRef }: { onPress: () => void; buttonRef?: React.Ref<View> }) {
  return (
    <Pressable
      ref={buttonRef}
      role="button"
      accessibilityLabel="Close"
      onPress={onPress}
      testID="review-close"
      style={({ hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [styles.close, hovered && styles.closeHover, focused && styles.closeFocused]}
    >
      <Text style={styles.closeText}>Close</Text>
    </Pressable>
  );
}

/** Beside the editor on wide screens (≥ 1024 px): part of the page, closed from its button or the bar. */
export function ReviewSidePanel(props: ReviewPanelProps) {
  return (
    <View role="region" aria-label={`Review of v${props.version}`} style={styles.side} testID="review-panel">
      <View style={styles.titleRow}>
        <Heading level={2}>Review of v{props.version}</Heading>
        <CloseButton onPress={props.onClose} />
      </View>
      <ReviewContent {...props} />
    </View>
  );
}

/**
 * Over the page on phones and tablets: a modal sheet that takes the focus (its Close button) and,
 * when closed, gives it back to what opened it; Escape closes it on the web.
 */
export function ReviewSheet({ visible, ...props }: ReviewPanelProps & { visible: boolean }) {
  const insets = useSafeAreaInsets();
  const close = useRef<View>(null);
  const sheet = useRef<View>(null);
  useEffect(() => {
    if (!visible) return;
    // Never take the focus back from a control inside the sheet: on a busy page the timer can
    // fire after the person (or a screen reader) has already moved into it.
    const timer = setTimeout(() => {
      if (!holdsFocus(sheet.current)) focusNode(close.current);
    }, 80);
    return () => clearTimeout(timer);
  }, [visible]);
  return (
    <Modal
      visible={visible}
      transparent
      animationType="none"
      onRequestClose={props.onClose}
      {...({ 'aria-label': `Review of v${props.version}` } as object)}
    >
      <View style={[styles.backdrop, { paddingTop: insets.top + space.xl }]}>
        <View ref={sheet} style={styles.sheet} testID="review-panel">
          <View style={styles.titleRow}>
            <Heading level={2}>Review of v{props.version}</Heading>
            <CloseButton onPress={props.onClose} buttonRef={close} />
          </View>
          <ScrollView contentContainerStyle={[styles.sheetBody, { paddingBottom: insets.bottom + space.xl }]} testID="review-sheet-scroll">
            <ReviewContent {...props} />
          </ScrollView>
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  content: { gap: space.lg },
  section: { gap: space.md },
  list: { gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  titleRow: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  side: { gap: space.md },
  backdrop: { flex: 1, backgroundColor: 'rgba(20, 28, 40, 0.45)', justifyContent: 'flex-end' },
  sheet: {
    flex: 1,
    backgroundColor: colors.paper,
    borderTopLeftRadius: radius.lg,
    borderTopRightRadius: radius.lg,
    paddingTop: space.md,
    paddingHorizontal: space.lg,
    gap: space.sm,
    maxWidth: 760,
    width: '100%',
    alignSelf: 'center',
  },
  sheetBody: { gap: space.lg },
  close: {
    minHeight: minTouch,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.primary,
    backgroundColor: colors.surface,
    justifyContent: 'center',
  },
  closeHover: { backgroundColor: colors.surfaceSunken },
  closeFocused: { borderColor: colors.focus, borderWidth: 2 },
  closeText: { ...type.body, fontFamily: fonts.semibold, color: colors.primary },
});
