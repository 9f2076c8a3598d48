import { forwardRef, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { formatWhen } from '@/shared/format';
import { editRemarkRequestSchema, pinLabel, replyRequestSchema, type Pin, type Remark, type Thread } from '@/shared/reviews';
import type { Member } from '@/shared/teams';
// The file, not the notebooks index: that index reaches back into this feature.
import { MarkdownView } from '@/features/notebooks/components/markdown-view';
import { Button, Text, colors, radius, space } from '@/features/ui';
import { carryLine, resolvedLine } from '../carry';
import { callProblem, parseProblem } from '../remark-errors';
import { useEditRemarkMutation, useRemoveRemarkMutation, useReplyMutation, useSetThreadStatusMutation } from '../thread-queries';
import { keptMentions } from '../mentions';
import { MentionField } from './mention-field';

type Common = {
  designId: string;
  /** The version being looked at (its review's cache is the one updated). */
  version: number;
  userId: string;
  canWrite: boolean;
  members: readonly Member[];
};

function RemarkItem({ remark, thread, designId, version, userId, canWrite, members }: Common & { remark: Remark; thread: Thread }) {
  const [showEarlier, setShowEarlier] = useState(false);
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [text, setText] = useState(remark.body ?? '');
  const [chosen, setChosen] = useState<ReadonlyMap<string, string>>(() => new Map(remark.mentions.map((p) => [p.id, p.displayName])));
  const [error, setError] = useState<string | null>(null);
  const edit = useEditRemarkMutation(designId, version);
  const remove = useRemoveRemarkMutation(designId, version);
  const pin = pinLabel(thread.pin);

  if (remark.body === null) {
    return (
      <View style={styles.remark} testID="remark-removed">
        <Text variant="small" tone="muted">
          A remark was removed{remark.removedAt ? ` (${formatWhen(remark.removedAt)})` : ''}.
        </Text>
      </View>
    );
  }
  const mine = canWrite && remark.author?.id === userId;
  const save = async () => {
    setError(null);
    const checked = editRemarkRequestSchema.safeParse({ body: text, mentions: keptMentions(text, chosen) });
    if (!checked.success) return setError(parseProblem(checked.error));
    try {
      await edit.mutateAsync({ remarkId: remark.id, ...checked.data });
      setEditing(false);
    } catch (failure) {
      setError(callProblem(failure, 'The remark could not be saved; try again.'));
    }
  };
  const removeNow = async () => {
    setError(null);
    try {
      await remove.mutateAsync({ remarkId: remark.id });
    } catch (failure) {
      setError(callProblem(failure, 'The remark could not be removed; try again.'));
    }
  };
  return (
    <View style={styles.remark} testID="remark">
      <View style={styles.head}>
        <Text variant="small" weight="semibold">
          {remark.author?.displayName ?? remark.authorName}
        </Text>
        <Text variant="small" tone="muted">
          {formatWhen(remark.createdAt)}
        </Text>
        {remark.editedAt ? (
          <Pressable
            role="button"
            aria-expanded={showEarlier}
            accessibilityLabel={showEarlier ? 'edited, hide the earlier text' : 'edited, show the earlier text'}
            onPress={() => setShowEarlier((v) => !v)}
            style={styles.edited}
            testID="remark-edited"
          >
            <Text variant="small" style={styles.link}>
              edited
            </Text>
          </Pressable>
        ) : null}
      </View>
      {showEarlier ? (
        <View style={styles.earlier} testID="remark-earlier">
          {remark.earlierBodies.map((earlier, index) => (
            <View key={index} style={styles.earlierItem}>
              <Text variant="caption" tone="muted">
                Earlier text, replaced {formatWhen(earlier.replacedAt)}
              </Text>
              <MarkdownView source={earlier.body} mentions={remark.mentions.map((p) => p.displayName)} emptyText="" />
            </View>
          ))}
        </View>
      ) : null}
      {editing ? (
        <View style={styles.form}>
          <MentionField
            label="Edit your remark"
            value={text}
            onChange={(next) => {
              setText(next);
              setError(null);
            }}
            chosen={chosen}
            onChoose={setChosen}
            members={members}
            userId={userId}
            error={error}
            autoFocus
            testID="edit-remark-body"
          />
          <View style={styles.actions}>
            <Button label={edit.isPending ? 'Saving…' : 'Save remark'} onPress={() => void save()} disabled={edit.isPending} testID="save-remark" />
            <Button kind="quiet" label="Cancel" onPress={() => (setEditing(false), setText(remark.body ?? ''), setError(null))} />
          </View>
        </View>
      ) : (
        <View testID="remark-body">
          <MarkdownView source={remark.body} mentions={remark.mentions.map((p) => p.displayName)} emptyText="" />
        </View>
      )}
      {mine && !editing ? (
        confirming ? (
          <View style={styles.confirm} role="group" aria-label="Remove this remark?">
            <Text variant="small" weight="semibold">
              Remove this remark? The thread will show that a remark was removed.
            </Text>
            <View style={styles.actions}>
              <Button label={remove.isPending ? 'Removing…' : 'Remove'} onPress={() => void removeNow()} disabled={remove.isPending} testID="confirm-remove" />
              <Button kind="quiet" label="Keep it" onPress={() => setConfirming(false)} testID="keep-remark" />
            </View>
          </View>
        ) : (
          <View style={styles.actions}>
            <Button kind="quiet" label="Edit" accessibilityLabel={`Edit your remark on ${pin}`} onPress={() => setEditing(true)} testID="edit-remark" />
            <Button kind="quiet" label="Remove" accessibilityLabel={`Remove your remark on ${pin}`} onPress={() => setConfirming(true)} testID="remove-remark" />
          </View>
        )
      ) : null}
      {error && !editing ? (
        <Text role="alert" tone="danger" variant="small">
          {error}
        </Text>
      ) : null}
    </View>
  );
}

type Props = Common & {
  thread: Thread;
  /** Opened from a marker or a link: drawn with the focus colour. */
  focused: boolean;
  /** The pin label was tapped: show what it is pinned to (a field scrolls into view). */
  onShowPin: (pin: Pin) => void;
  /** Resolved or reopened here, with the server's answer. */
  onStatusChanged?: (thread: Thread) => void;
};

/** One thread: what it is pinned to, how it reads on this version, its remarks oldest first, reply and resolve. */
export const ThreadCard = forwardRef<View, Props>(function ThreadCard({ thread, focused, onShowPin, onStatusChanged, ...common }, ref) {
  const { designId, version, canWrite, members, userId } = common;
  const [replying, setReplying] = useState(false);
  const [reply, setReply] = useState('');
  const [chosen, setChosen] = useState<ReadonlyMap<string, string>>(new Map());
  const [error, setError] = useState<string | null>(null);
  const send = useReplyMutation(designId, version);
  const status = useSetThreadStatusMutation(designId, version);
  const label = pinLabel(thread.pin);
  const carry = carryLine(thread);
  const resolved = thread.status === 'resolved';

  const sendReply = async () => {
    setError(null);
    const checked = replyRequestSchema.safeParse({ body: reply, mentions: keptMentions(reply, chosen) });
    if (!checked.success) return setError(parseProblem(checked.error));
    try {
      await send.mutateAsync({ threadId: thread.id, ...checked.data });
      setReply('');
      setChosen(new Map());
      setReplying(false);
    } catch (failure) {
      setError(callProblem(failure, 'The reply could not be sent. It is still in the box; try again.'));
    }
  };
  const setStatus = async () => {
    setError(null);
    try {
      const answer = await status.mutateAsync({ threadId: thread.id, status: resolved ? 'open' : 'resolved' });
      onStatusChanged?.({ ...answer.thread, carry: thread.carry });
    } catch (failure) {
      setError(callProblem(failure, 'The thread could not be changed; try again.'));
    }
  };

  return (
    <View
      ref={ref}
      role="article"
      aria-label={`Thread on ${label}`}
      style={[styles.thread, resolved && styles.threadResolved, focused && styles.threadFocused]}
      testID={`thread-${thread.id}`}
    >
      <View style={styles.head}>
        <Text variant="small" tone="muted">
          Pinned to
        </Text>
        {thread.pin.kind === 'field' ? (
          <Pressable
            role="button"
            accessibilityLabel={`${label}, show the field`}
            onPress={() => onShowPin(thread.pin)}
            style={({ focused: f }: { pressed: boolean; focused?: boolean }) => [styles.pin, f && styles.pinFocused]}
            testID="thread-pin"
          >
            <Text variant="small" weight="semibold" style={styles.link}>
              {label}
            </Text>
          </Pressable>
        ) : (
          <Text variant="small" weight="semibold" testID="thread-pin">
            {label}
          </Text>
        )}
        {thread.version !== version ? (
          <Text variant="small" tone="muted">
            · started on v{thread.version}
          </Text>
        ) : null}
      </View>
      {carry ? (
        <Text variant="small" weight="semibold" style={styles.carry} testID="thread-carry">
          {carry}
        </Text>
      ) : null}
      {resolved ? (
        <Text variant="small" tone="ok" weight="semibold" testID="thread-resolved">
          {resolvedLine(thread)}
        </Text>
      ) : null}
      <View style={styles.remarks}>
        {thread.remarks.map((remark) => (
          <RemarkItem key={remark.id} remark={remark} thread={thread} {...common} />
        ))}
      </View>
      {canWrite && replying ? (
        <View style={styles.form}>
          <MentionField
            label={`Reply on ${label}`}
            value={reply}
            onChange={(next) => {
              setReply(next);
              setError(null);
            }}
            chosen={chosen}
            onChoose={setChosen}
            members={members}
            userId={userId}
            error={null}
            autoFocus
            testID="reply-body"
          />
        </View>
      ) : null}
      {error ? (
        <Text role="alert" tone="danger" variant="small" weight="semibold" testID="thread-error">
          {error}
        </Text>
      ) : null}
      {canWrite ? (
        <View style={styles.actions}>
          {replying ? (
            <>
              <Button label={send.isPending ? 'Sending…' : 'Send reply'} onPress={() => void sendReply()} disabled={send.isPending} testID="send-reply" />
              <Button kind="quiet" label="Cancel" onPress={() => (setReplying(false), setError(null))} />
            </>
          ) : (
            <Button kind="secondary" label="Reply" accessibilityLabel={`Reply on ${label}`} onPress={() => setReplying(true)} testID="reply" />
          )}
          <Button
            kind="secondary"
            label={resolved ? 'Reopen' : 'Resolve'}
            accessibilityLabel={`${resolved ? 'Reopen' : 'Resolve'} the thread on ${label}`}
            onPress={() => void setStatus()}
            disabled={status.isPending}
            testID={resolved ? 'reopen-thread' : 'resolve-thread'}
          />
        </View>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  thread: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  threadResolved: { backgroundColor: colors.surfaceSunken },
  threadFocused: { borderColor: colors.accent, borderWidth: 2 },
  head: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: space.xs, rowGap: space.xxs },
  pin: { minHeight: 24, justifyContent: 'center', borderRadius: radius.sm, paddingHorizontal: space.xxs },
  pinFocused: { outlineColor: colors.focus, outlineWidth: 2, outlineStyle: 'solid' },
  link: { color: colors.primary, textDecorationLine: 'underline' },
  carry: { color: colors.accent },
  remarks: { gap: space.sm },
  remark: { gap: space.xxs, borderLeftWidth: 3, borderLeftColor: colors.line, paddingLeft: space.sm },
  edited: { minHeight: 24, minWidth: 24, justifyContent: 'center' },
  earlier: { gap: space.xs, padding: space.sm, borderRadius: radius.sm, backgroundColor: colors.surfaceSunken },
  earlierItem: { gap: space.xxs },
  confirm: { gap: space.xs, padding: space.sm, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.danger },
  form: { gap: space.xs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
