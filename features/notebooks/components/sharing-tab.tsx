import { useRouter, type Href } from 'expo-router';
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Notebook, ShareLink, Version } from '@/shared/notebooks';
import { exportFileName } from '@/shared/export-file-name';
import { can } from '@/shared/teams';
import { useTeamsQuery } from '@/features/teams';
import { Button, Card, Screen, Text, TextField, colors, copyText, saveTextFile, space } from '@/features/ui';
import { formatDay, formatWhen } from '../format';
import { focusButton } from '../hooks/focus-button';
import {
  fetchNotebookFile,
  useBaselineMutation,
  useCloneMutation,
  useCreateShareLinkMutation,
  useRevokeShareLinkMutation,
  useShareLinksQuery,
} from '../queries';
import { absoluteUrl } from '../links';
import { ChoiceChips } from './choice-chips';

const errorText = (error: unknown) => (error instanceof Error ? error.message : 'That did not work.');

function ClonePanel({ design, version }: { design: Notebook; version: Version }) {
  const router = useRouter();
  const teams = useTeamsQuery();
  const owned = (teams.data ?? []).filter((team) => team.role === 'owner');
  const personal = owned.find((team) => team.personal);
  const [teamId, setTeamId] = useState<string | null>(null);
  const [title, setTitle] = useState(design.title);
  const clone = useCloneMutation(design.id);
  const target = teamId ?? personal?.id ?? owned[0]?.id ?? '';
  const submit = async () => {
    const made = await clone.mutateAsync({
      version: version.number,
      teamId: target || undefined,
      title: title.trim() || undefined,
    });
    router.push(`/notebooks/${made.design.id}` as Href);
  };
  return (
    <Card title={`Clone v${version.number}`} testID="clone-card">
      <Text tone="muted">
        Start your own design from this version. The copy begins a new history and says where it came from:
        “from {design.title} v{version.number}”.
      </Text>
      {owned.length > 1 ? (
        <ChoiceChips
          label="Into"
          options={owned.map((team) => ({
            value: team.id,
            label: team.personal ? 'Personal workspace' : team.name,
          }))}
          value={target}
          onChange={setTeamId}
          testID="clone-team"
        />
      ) : (
        <Text variant="small" tone="muted">
          Into your personal workspace.
        </Text>
      )}
      <TextField
        label="Title of the copy"
        value={title}
        onChangeText={setTitle}
        maxLength={120}
        testID="clone-title"
      />
      {clone.isError ? (
        <Text role="alert" tone="danger">
          {errorText(clone.error)}
        </Text>
      ) : null}
      <View style={styles.row}>
        <Button
          label={clone.isPending ? 'Cloning…' : `Clone v${version.number}`}
          onPress={() => void submit().catch(() => undefined)}
          disabled={clone.isPending || !target}
          testID="clone-submit"
        />
      </View>
    </Card>
  );
}

function BaselinePanel({ design, version }: { design: Notebook; version: Version }) {
  const baseline = useBaselineMutation(design.id);
  const isBaseline = design.baselineVersion === version.number;
  return (
    <Card title="Team baseline" testID="baseline-card">
      <Text tone="muted">
        {design.baselineVersion === null
          ? 'No version of this design is the team’s baseline. A baseline is listed first, so colleagues start from it.'
          : `v${design.baselineVersion} is the team’s baseline: it is listed first, so colleagues start from it.`}
      </Text>
      {baseline.isError ? (
        <Text role="alert" tone="danger">
          {errorText(baseline.error)}
        </Text>
      ) : null}
      <View style={styles.row}>
        {!isBaseline ? (
          <Button
            label={`Mark v${version.number} as baseline`}
            onPress={() => baseline.mutate(version.number)}
            disabled={baseline.isPending}
            testID="mark-baseline"
          />
        ) : null}
        {design.baselineVersion !== null ? (
          <Button
            kind="quiet"
            label="Clear the baseline"
            onPress={() => baseline.mutate(null)}
            disabled={baseline.isPending}
            testID="clear-baseline"
          />
        ) : null}
      </View>
    </Card>
  );
}

type Expiry = 'never' | '7' | '30';
const expiries: { value: Expiry; label: string }[] = [
  { value: 'never', label: 'Never expires' },
  { value: '7', label: '7 days' },
  { value: '30', label: '30 days' },
];

function SharePanel({ design, version }: { design: Notebook; version: Version }) {
  const links = useShareLinksQuery(design.id, true);
  const create = useCreateShareLinkMutation(design.id);
  const revoke = useRevokeShareLinkMutation(design.id);
  const [pin, setPin] = useState<'version' | 'latest'>('version');
  const [expiry, setExpiry] = useState<Expiry>('never');
  const [made, setMade] = useState<{ url: string; copied: boolean | null } | null>(null);

  const submit = async () => {
    const expiresAt =
      expiry === 'never' ? null : new Date(Date.now() + Number(expiry) * 86_400_000).toISOString();
    const answer = await create.mutateAsync({
      version: pin === 'version' ? version.number : null,
      expiresAt,
    });
    setMade({ url: absoluteUrl(answer.path), copied: null });
  };
  const copy = async () => {
    if (!made) return;
    const copied = await copyText(made.url);
    setMade({ ...made, copied });
  };

  return (
    <Card title="Read-only links" testID="share-card">
      <Text tone="muted">
        Anyone with a link sees this design read-only — the workbench, the notes and the plots — without
        signing in. No comments, members or other designs.
      </Text>
      <ChoiceChips
        label="Shows"
        options={[
          { value: 'version', label: `v${version.number} only` },
          { value: 'latest', label: 'Always the latest' },
        ]}
        value={pin}
        onChange={setPin}
        testID="share-pin"
      />
      <ChoiceChips
        label="Expires"
        options={expiries}
        value={expiry}
        onChange={setExpiry}
        testID="share-expiry"
      />
      <View style={styles.row}>
        <Button
          label={create.isPending ? 'Creating…' : 'Create link'}
          onPress={() => void submit().catch(() => undefined)}
          disabled={create.isPending}
          testID="create-share-link"
        />
      </View>
      {create.isError ? (
        <Text role="alert" tone="danger">
          {errorText(create.error)}
        </Text>
      ) : null}
      {made ? (
        <View style={styles.made} testID="new-share-link">
          <Text variant="small" weight="semibold">
            New link (shown once — copy it now):
          </Text>
          <Text variant="number" selectable style={styles.url} testID="share-url">
            {made.url}
          </Text>
          <View style={styles.row}>
            <Button
              kind="secondary"
              label={made.copied ? 'Copied' : 'Copy link'}
              onPress={() => void copy()}
              testID="copy-share-link"
            />
          </View>
          {made.copied === false ? (
            <Text variant="small" tone="warning">
              The browser did not allow copying; select the address above instead.
            </Text>
          ) : null}
        </View>
      ) : null}
      {revoke.isError ? (
        <Text role="alert" tone="danger">
          {errorText(revoke.error)}
        </Text>
      ) : null}
      {revoke.isSuccess ? (
        <Text role="status" tone="ok" testID="revoke-status">
          The link was revoked: it no longer opens.
        </Text>
      ) : null}
      {links.data && links.data.length > 0 ? (
        <View role="list" style={styles.links}>
          {links.data.map((link) => (
            <View key={link.id} role="listitem" style={styles.link} testID={`share-link-${link.id}`}>
              <View style={styles.linkText}>
                <Text weight="semibold">{link.version === null ? 'Latest version' : `v${link.version}`}</Text>
                <Text variant="small" tone="muted">
                  {link.createdBy?.displayName ?? 'Former member'} · {formatWhen(link.createdAt)} ·{' '}
                  {link.revokedAt
                    ? `revoked ${formatDay(link.revokedAt)}`
                    : link.expiresAt
                      ? `${link.active ? 'expires' : 'expired'} ${formatDay(link.expiresAt)}`
                      : 'no expiry'}
                </Text>
              </View>
              {link.active ? (
                <RevokeControl link={link} onRevoke={() => revoke.mutate(link.id)} busy={revoke.isPending} />
              ) : (
                <Text variant="small" tone="muted">
                  Inactive
                </Text>
              )}
            </View>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

const linkName = (link: ShareLink) => `the link to ${link.version === null ? 'the latest version' : `v${link.version}`}`;

/**
 * Revoking cannot be undone (whoever holds the link loses it for good), so it asks first. Focus
 * moves to the safe choice when the question appears, and back to "Revoke" when it is kept.
 */
function RevokeControl({ link, onRevoke, busy }: { link: ShareLink; onRevoke: () => void; busy: boolean }) {
  const [asking, setAsking] = useState(false);
  const box = useRef<View>(null);
  const revokeName = `Revoke ${linkName(link)}`;
  const [focusOn, setFocusOn] = useState<string | null>(null);
  useEffect(() => {
    if (focusOn) focusButton(box.current, focusOn);
  }, [focusOn, asking]);

  if (!asking) {
    return (
      <View ref={box}>
        <Button
          kind="quiet"
          label="Revoke"
          accessibilityLabel={revokeName}
          onPress={() => {
            setAsking(true);
            setFocusOn('Keep link');
          }}
          disabled={busy}
          testID={`revoke-${link.id}`}
        />
      </View>
    );
  }
  return (
    <View ref={box} role="group" aria-label={`Revoke ${linkName(link)}?`} style={styles.confirm} testID={`confirm-revoke-${link.id}`}>
      <Text variant="small" weight="semibold">
        Revoke {linkName(link)}? Whoever has it will no longer be able to open it.
      </Text>
      <View style={styles.row}>
        <Button
          label="Revoke link"
          onPress={() => {
            setAsking(false);
            setFocusOn(null);
            onRevoke();
          }}
          disabled={busy}
          testID={`revoke-confirm-${link.id}`}
        />
        <Button
          kind="secondary"
          label="Keep link"
          onPress={() => {
            setAsking(false);
            setFocusOn(revokeName);
          }}
          testID={`revoke-keep-${link.id}`}
        />
      </View>
    </View>
  );
}

function ExportPanel({ design }: { design: Notebook }) {
  const [state, setState] = useState<{ busy: boolean; message: string | null; error: boolean }>({
    busy: false,
    message: null,
    error: false,
  });
  const run = async () => {
    setState({ busy: true, message: null, error: false });
    try {
      const file = await fetchNotebookFile(design.id);
      const saved = await saveTextFile(`${JSON.stringify(file, null, 2)}\n`, exportFileName(design.title));
      setState({
        busy: false,
        message: saved ? `Saved ${exportFileName(design.title)} with ${file.versions.length} versions.` : null,
        error: false,
      });
    } catch (error) {
      setState({ busy: false, message: errorText(error), error: true });
    }
  };
  return (
    <Card title="Export" testID="export-card">
      <Text tone="muted">
        Every version with its notes, as one JSON file of Blazebook’s own notebook format. Import it into any
        team from the design list.
      </Text>
      <View style={styles.row}>
        <Button
          kind="secondary"
          label={state.busy ? 'Exporting…' : 'Download notebook file'}
          onPress={() => void run()}
          disabled={state.busy}
          testID="export-notebook"
        />
      </View>
      {state.message ? (
        <Text
          role={state.error ? 'alert' : 'status'}
          tone={state.error ? 'danger' : 'ok'}
          testID="export-status"
        >
          {state.message}
        </Text>
      ) : null}
    </Card>
  );
}

/**
 * Everything that takes the design out of this screen: clone, baseline, links and the file.
 * `top`: the notebook's header, when it should scroll away with the page (phones).
 */
export function SharingTab({ design, version, top }: { design: Notebook; version: Version; top?: ReactNode }) {
  return (
    <Screen>
      {top}
      <ClonePanel design={design} version={version} />
      {can(design.role, 'designs.edit') ? <BaselinePanel design={design} version={version} /> : null}
      {can(design.role, 'share.manage') ? <SharePanel design={design} version={version} /> : null}
      <ExportPanel design={design} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  made: { gap: space.xs, padding: space.md, backgroundColor: colors.okSoft, borderRadius: 8 },
  url: { fontSize: 14, wordBreak: 'break-all' } as object,
  links: { gap: space.xs },
  link: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.md,
    paddingVertical: space.xs,
    borderTopWidth: 1,
    borderTopColor: colors.line,
  },
  linkText: { flexShrink: 1, minWidth: 0, gap: space.xxs },
  // On a phone the question takes the row's full width under the link's details.
  confirm: { flexGrow: 1, flexBasis: 260, gap: space.xs },
});
