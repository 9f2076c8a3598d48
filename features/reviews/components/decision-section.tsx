import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { fieldLabel } from '@/shared/design-fields';
import { formatDay, formatWhen } from '@/shared/format';
import {
  decisionOutcomeLabels,
  decisionSummaryMaxLength,
  recordDecisionRequestSchema,
  requestReviewSchema,
  type Decision,
  type DecisionOutcome,
  type ReviewRequestItem,
  type VersionReview,
} from '@/shared/reviews';
import { can, type Role } from '@/shared/teams';
import type { FieldErrors } from '@/shared/validation';
import { fieldErrors } from '@/shared/validation';
import { ApiError } from '@/features/api';
import { Button, Heading, Text, TextField, colors, fonts, minTouch, radius, space, type } from '@/features/ui';
import { useDecideMutation, useRequestReviewMutation, useReviewerChoicesQuery } from '../decision-queries';
import { ReviewStateBadge } from './review-state-badge';

type Props = {
  designId: string;
  version: number;
  /** The caller's role in the design's team: the server decides, this only hides the forms. */
  role: Role;
  userId: string;
  review: VersionReview;
};

/** A reviewer's name as the answer gives it: the account's, or the name kept when it was deleted. */
function reviewerName(decision: Decision): string {
  return decision.reviewer?.displayName ?? decision.reviewerName;
}

/** A due date is a calendar day, not an instant: read in UTC so it never slips a day. */
function dueDay(date: string): string {
  return formatDay(`${date}T00:00:00Z`, 'UTC');
}

/** The server's refusal in words: its reason for the field when it named one, else its message. */
function refusal(failure: unknown, labels: Record<string, string>, fallback: string): { fields: FieldErrors; message: string | null } {
  if (!(failure instanceof ApiError)) return { fields: {}, message: fallback };
  const fields: FieldErrors = {};
  for (const [path, why] of Object.entries(failure.fields)) {
    const label = labels[path.split('.')[0] ?? path];
    if (label) fields[path.split('.')[0] ?? path] = `${label} ${why}`;
  }
  return { fields, message: Object.keys(fields).length > 0 ? null : failure.message };
}

/**
 * The sign-off part of a version's review: its state, what an earlier sign-off covered and what
 * changed since, the decisions and requests on it, the decision form for reviewers who did not
 * write the version, and the request form for owners.
 */
export function DecisionSection({ designId, version, role, userId, review }: Props) {
  const mayDecide = can(role, 'designs.review');
  const isAuthor = review.authorId !== null && review.authorId === userId;
  const mayRequest = can(role, 'designs.edit');
  return (
    <View style={styles.root} testID="decision-section">
      <View style={styles.row}>
        <Text weight="semibold">Review state of v{version}:</Text>
        <ReviewStateBadge state={review.state} testID="review-state" />
      </View>
      {review.earlierSignOff ? <EarlierSignOff signOff={review.earlierSignOff} /> : null}
      {review.decisions.length > 0 ? <DecisionList decisions={review.decisions} /> : null}
      {review.requests.length > 0 ? <RequestList requests={review.requests} /> : null}
      {mayDecide && isAuthor ? (
        <Text tone="muted" testID="decision-author-note">
          You wrote v{version}; another owner or reviewer decides on it.
        </Text>
      ) : mayDecide ? (
        <DecisionForm designId={designId} version={version} />
      ) : null}
      {mayRequest ? <RequestForm designId={designId} version={version} authorId={review.authorId} /> : null}
    </View>
  );
}

function EarlierSignOff({ signOff }: { signOff: NonNullable<VersionReview['earlierSignOff']> }) {
  const { decision, changedPaths } = signOff;
  const how = decisionOutcomeLabels[decision.outcome].toLowerCase();
  return (
    <View style={styles.note} testID="earlier-sign-off">
      <Text>
        v{decision.version} was {how} by {reviewerName(decision)} on {formatDay(decision.createdAt)}.
      </Text>
      <Text tone="muted">
        {changedPaths.length === 0 ? 'Nothing changed since.' : `Changed since: ${changedPaths.map(fieldLabel).join(', ')}.`}
      </Text>
    </View>
  );
}

function DecisionList({ decisions }: { decisions: readonly Decision[] }) {
  const oldestFirst = [...decisions].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return (
    <View style={styles.group}>
      <Heading level={3}>Decisions</Heading>
      {oldestFirst.map((decision) => (
        <View key={decision.id} style={styles.item} testID="decision-item">
          <View style={styles.row}>
            <Text weight="semibold">{reviewerName(decision)}</Text>
            <ReviewStateBadge state={decision.outcome} />
            <Text variant="small" tone="muted">
              {formatWhen(decision.createdAt)}
            </Text>
          </View>
          {/* Plain text: a summary is never read as Markdown or HTML. */}
          <Text selectable>{decision.summary}</Text>
        </View>
      ))}
    </View>
  );
}

function RequestList({ requests }: { requests: readonly ReviewRequestItem[] }) {
  return (
    <View style={styles.group}>
      <Heading level={3}>Review requests</Heading>
      {requests.map((request) => (
        <View key={request.id} style={styles.item} testID="review-request-item">
          <Text>
            <Text weight="semibold">{request.reviewer.displayName}</Text>
            {request.dueDate ? `, due ${dueDay(request.dueDate)}` : ''}
            {request.answeredAt ? ` — answered ${formatDay(request.answeredAt)}` : ' — waiting'}
          </Text>
          <Text variant="small" tone="muted">
            Asked by {request.requestedBy?.displayName ?? 'a former member'} on {formatDay(request.createdAt)}
          </Text>
          {request.note ? <Text selectable>{request.note}</Text> : null}
        </View>
      ))}
    </View>
  );
}

const outcomeButtons: { outcome: DecisionOutcome; kind: 'primary' | 'secondary' }[] = [
  { outcome: 'signed-off', kind: 'primary' },
  { outcome: 'signed-off-with-remarks', kind: 'secondary' },
  { outcome: 'revise', kind: 'secondary' },
];
const outcomeVerbs: Record<DecisionOutcome, string> = {
  'signed-off': 'Sign off',
  'signed-off-with-remarks': 'Sign off with remarks',
  revise: 'Revise',
};

function DecisionForm({ designId, version }: { designId: string; version: number }) {
  const decide = useDecideMutation(designId, version);
  const [summary, setSummary] = useState('');
  const [summaryError, setSummaryError] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const submit = async (outcome: DecisionOutcome) => {
    setError(null);
    setDone(null);
    const checked = recordDecisionRequestSchema.safeParse({ outcome, summary });
    if (!checked.success) {
      const why = fieldErrors(checked.error);
      setSummaryError(why.summary ? `Decision summary ${why.summary}` : null);
      if (!why.summary) setError(Object.values(why)[0] ?? 'The decision is not valid.');
      return;
    }
    try {
      await decide.mutateAsync(checked.data);
      setSummary('');
      setDone(`Your decision on v${version} is recorded: ${decisionOutcomeLabels[outcome]}.`);
    } catch (failure) {
      // A 403 (e.g. the caller wrote the version after all) says why in its message.
      const { fields, message } = refusal(failure, { summary: 'Decision summary' }, 'The decision could not be sent. It is still in the box; try again.');
      setSummaryError(fields.summary ?? null);
      setError(message);
    }
  };

  return (
    <View style={styles.group} testID="decision-form">
      <Heading level={3}>{`Your decision on v${version}`}</Heading>
      <TextField
        label="Decision summary"
        value={summary}
        onChangeText={(text) => {
          setSummary(text);
          setSummaryError(null);
        }}
        multiline
        numberOfLines={3}
        maxLength={decisionSummaryMaxLength}
        error={summaryError}
        testID="decision-summary"
      />
      <View style={styles.actions}>
        {outcomeButtons.map(({ outcome, kind }) => (
          <Button
            key={outcome}
            kind={kind}
            label={outcomeVerbs[outcome]}
            onPress={() => void submit(outcome)}
            disabled={decide.isPending}
            testID={`decide-${outcome}`}
          />
        ))}
      </View>
      {error ? (
        <Text role="alert" tone="danger" testID="decision-error">
          {error}
        </Text>
      ) : null}
      {done ? (
        <Text role="status" tone="ok" testID="decision-done">
          {done}
        </Text>
      ) : null}
    </View>
  );
}

const requestLabels = { reviewerIds: 'Reviewers', dueDate: 'Due date', note: 'Note' };

function RequestForm({ designId, version, authorId }: { designId: string; version: number; authorId: string | null }) {
  const [open, setOpen] = useState(false);
  const [chosen, setChosen] = useState<readonly string[]>([]);
  const [dueDate, setDueDate] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const choices = useReviewerChoicesQuery(designId, authorId, open);
  const send = useRequestReviewMutation(designId, version);

  const toggle = (id: string) => {
    setChosen((now) => (now.includes(id) ? now.filter((one) => one !== id) : [...now, id]));
    setErrors(({ reviewerIds: _gone, ...rest }) => rest);
  };

  const submit = async () => {
    setError(null);
    setDone(null);
    const checked = requestReviewSchema.safeParse({ reviewerIds: chosen, dueDate: dueDate.trim() === '' ? null : dueDate.trim(), note });
    if (!checked.success) {
      const why = fieldErrors(checked.error);
      const named: FieldErrors = {};
      for (const [path, reason] of Object.entries(why)) {
        const field = path.split('.')[0] ?? path;
        if (!(field in named)) named[field] = field === 'reviewerIds' && chosen.length === 0 ? 'Reviewers: choose at least one person.' : `${requestLabels[field as keyof typeof requestLabels] ?? field} ${reason}`;
      }
      setErrors(named);
      return;
    }
    try {
      const answer = await send.mutateAsync(checked.data);
      const names = answer.requests.map((request) => request.reviewer.displayName).join(', ');
      setDone(`Review of v${version} requested from ${names}.`);
      setChosen([]);
      setDueDate('');
      setNote('');
      setErrors({});
      setOpen(false);
    } catch (failure) {
      const { fields, message } = refusal(failure, requestLabels, 'The request could not be sent; try again.');
      setErrors(fields);
      setError(message);
    }
  };

  if (!open) {
    return (
      <View style={styles.group}>
        {done ? (
          <Text role="status" tone="ok" testID="review-request-done">
            {done}
          </Text>
        ) : null}
        <View style={styles.actions}>
          <Button kind="secondary" label="Request a review" onPress={() => setOpen(true)} testID="review-request-open" />
        </View>
      </View>
    );
  }

  return (
    <View style={styles.group} testID="review-request-form">
      <Heading level={3}>{`Request a review of v${version}`}</Heading>
      <View style={styles.group} role="group" aria-labelledby="review-request-reviewers">
        <Text nativeID="review-request-reviewers" weight="semibold" variant="small">
          Reviewers
        </Text>
        {choices.isPending ? (
          <Text tone="muted">Loading the team…</Text>
        ) : choices.isError ? (
          <Text role="alert" tone="danger">
            {"The team's members could not be loaded."}
          </Text>
        ) : choices.data.length === 0 ? (
          <Text tone="muted">{"No other member of the team can review this version. Invite a reviewer from the team's members page."}</Text>
        ) : (
          <View style={styles.actions}>
            {choices.data.map((member) => {
              const on = chosen.includes(member.userId);
              return (
                <Pressable
                  key={member.userId}
                  role="button"
                  aria-pressed={on}
                  accessibilityLabel={member.displayName}
                  onPress={() => toggle(member.userId)}
                  testID={`review-request-reviewer-${member.userId}`}
                  style={({ focused }: { pressed: boolean; focused?: boolean }) => [styles.toggle, on && styles.toggleOn, focused && styles.toggleFocused]}
                >
                  <Text style={[styles.toggleText, on && styles.toggleTextOn]}>{`${on ? '✓ ' : ''}${member.displayName}`}</Text>
                </Pressable>
              );
            })}
          </View>
        )}
        {errors.reviewerIds ? (
          <Text role="alert" tone="danger" variant="small" testID="review-request-reviewers-error">
            {errors.reviewerIds}
          </Text>
        ) : null}
      </View>
      <TextField
        label="Due date (optional)"
        hint="As YYYY-MM-DD, e.g. 2026-12-24"
        value={dueDate}
        onChangeText={(text) => {
          setDueDate(text);
          setErrors(({ dueDate: _gone, ...rest }) => rest);
        }}
        autoCapitalize="none"
        autoCorrect={false}
        inputMode="numeric"
        maxLength={10}
        error={errors.dueDate ?? null}
        testID="review-request-due"
      />
      <TextField
        label="Note (optional)"
        value={note}
        onChangeText={(text) => {
          setNote(text);
          setErrors(({ note: _gone, ...rest }) => rest);
        }}
        multiline
        numberOfLines={2}
        maxLength={2000}
        error={errors.note ?? null}
        testID="review-request-note"
      />
      <View style={styles.actions}>
        <Button label="Send the request" onPress={() => void submit()} disabled={send.isPending} testID="review-request-send" />
        <Button kind="quiet" label="Cancel" onPress={() => setOpen(false)} testID="review-request-cancel" />
      </View>
      {error ? (
        <Text role="alert" tone="danger" testID="review-request-error">
          {error}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  group: { gap: space.sm },
  note: { gap: space.xxs, borderLeftWidth: 3, borderLeftColor: colors.ok, paddingLeft: space.sm },
  item: { gap: space.xxs, borderLeftWidth: 3, borderLeftColor: colors.line, paddingLeft: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  toggle: {
    minHeight: minTouch,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  toggleOn: { borderColor: colors.primary, backgroundColor: colors.primary },
  toggleFocused: { borderColor: colors.focus, borderWidth: 2 },
  toggleText: { ...type.body, fontFamily: fonts.regular, color: colors.ink },
  toggleTextOn: { color: colors.onPrimary, fontFamily: fonts.semibold },
});
