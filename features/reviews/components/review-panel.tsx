import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { formatWhen } from '@/shared/format';
import { reviewBodyMaxLength, reviewBodySchema, reviewDecisionLabels, type Review, type ReviewDecision } from '@/shared/reviews';
import { can, type Role } from '@/shared/teams';
import { ApiError } from '@/features/api';
import { Button, Card, Text, TextField, colors, radius, space } from '@/features/ui';
import { useCreateReviewMutation, useReviewsQuery } from '../queries';

type Props = {
  designId: string;
  version: number;
  /** The caller's role in the design's team: the server decides, this only hides the form. */
  role: Role;
};

const badgeStyle: Record<ReviewDecision, { backgroundColor: string; color: string }> = {
  approved: { backgroundColor: colors.okSoft, color: colors.ok },
  'changes-requested': { backgroundColor: colors.warningSoft, color: colors.warning },
};

function DecisionBadge({ decision }: { decision: ReviewDecision }) {
  const { backgroundColor, color } = badgeStyle[decision];
  return (
    <View style={[styles.badge, { backgroundColor }]} testID={`review-decision-${decision}`}>
      <Text variant="small" weight="semibold" style={{ color }}>
        {reviewDecisionLabels[decision]}
      </Text>
    </View>
  );
}

function ReviewItem({ review }: { review: Review }) {
  return (
    <View style={styles.item} testID="review-item">
      <View style={styles.itemHead}>
        <Text weight="semibold">{review.author?.displayName ?? 'Former member'}</Text>
        <Text variant="small" tone="muted">
          {formatWhen(review.createdAt)}
        </Text>
        {review.decision ? <DecisionBadge decision={review.decision} /> : null}
      </View>
      {/* Plain text: a review is never read as Markdown or HTML. */}
      <Text selectable>{review.body}</Text>
    </View>
  );
}

/** The review comments of one version, oldest first, with a form for owners and reviewers. */
export function ReviewPanel({ designId, version, role }: Props) {
  const reviews = useReviewsQuery(designId, version);
  const create = useCreateReviewMutation(designId, version);
  const [body, setBody] = useState('');
  const [error, setError] = useState<string | null>(null);
  const mayComment = can(role, 'designs.comment');
  const mayDecide = can(role, 'designs.review');

  const latestDecision = [...(reviews.data ?? [])].reverse().find((r) => r.decision !== null)?.decision ?? null;

  const submit = async (decision: ReviewDecision | null) => {
    setError(null);
    const checked = reviewBodySchema.safeParse(body);
    if (!checked.success) {
      setError(`The comment ${checked.error.issues[0]?.message ?? 'is not valid'}`);
      return;
    }
    try {
      // Emptied together with the list's update, so the comment never shows in both places.
      await create.mutateAsync({ body: checked.data, decision }, { onSuccess: () => setBody('') });
    } catch (failure) {
      setError(
        failure instanceof ApiError
          ? (failure.fields.body ? `The comment ${failure.fields.body}` : failure.message)
          : 'The comment could not be sent. It is still in the box; try again.',
      );
    }
  };

  return (
    <Card title={`Review of v${version}`} testID="review-panel">
      {latestDecision ? (
        <View style={styles.itemHead} testID="review-status">
          <Text variant="small" tone="muted">
            Latest decision:
          </Text>
          <DecisionBadge decision={latestDecision} />
        </View>
      ) : null}
      {reviews.isPending ? (
        <Text tone="muted">Loading the review…</Text>
      ) : reviews.isError ? (
        <Text role="alert" tone="danger">
          The review comments could not be loaded.
        </Text>
      ) : reviews.data.length === 0 ? (
        <Text tone="muted" testID="review-empty">
          No comments on this version yet.
        </Text>
      ) : (
        <View style={styles.list} testID="review-list">
          {reviews.data.map((review) => (
            <ReviewItem key={review.id} review={review} />
          ))}
        </View>
      )}
      {mayComment ? (
        <View style={styles.form}>
          <TextField
            label="Your comment"
            value={body}
            onChangeText={(text) => {
              setBody(text);
              setError(null);
            }}
            multiline
            numberOfLines={3}
            maxLength={reviewBodyMaxLength}
            error={error}
            testID="review-body"
          />
          <View style={styles.actions}>
            <Button kind="secondary" label="Comment" onPress={() => void submit(null)} disabled={create.isPending} testID="review-comment" />
            {mayDecide ? (
              <>
                <Button label="Approve" onPress={() => void submit('approved')} disabled={create.isPending} testID="review-approve" />
                <Button
                  kind="secondary"
                  label="Request changes"
                  onPress={() => void submit('changes-requested')}
                  disabled={create.isPending}
                  testID="review-request-changes"
                />
              </>
            ) : null}
          </View>
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  item: { gap: space.xxs, borderLeftWidth: 3, borderLeftColor: colors.line, paddingLeft: space.sm },
  itemHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  badge: { borderRadius: radius.sm, paddingHorizontal: space.xs, paddingVertical: space.xxs },
  form: { gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
