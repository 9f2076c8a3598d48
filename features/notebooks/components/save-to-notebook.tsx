import { usePathname, useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';
import { fieldLabel } from '@/shared/design-fields';
import { designTitleSchema } from '@/shared/notebooks';
import { can } from '@/shared/teams';
import { ApiError } from '@/features/api';
import { useSessionQuery } from '@/features/auth';
import { useTeamsQuery } from '@/features/teams';
import { Button, Card, RadioGroup, Text, TextField, space } from '@/features/ui';
// Not the ui index: that would pull React Native components into the unit tests.
import { persistedState } from '@/features/ui/persisted-state';
// A type only: the workbench renders this panel, so a value import back into it would be a cycle.
import type { FormResult } from '@/features/workbench/form-model';
import { useCreateDesignMutation } from '../queries';

/** Where the panel's state waits while its user signs in (or reloads): open, title, team. */
export const SAVE_TO_NOTEBOOK_KEY = 'blazebook.save-to-notebook';

const pendingSchema = z.object({
  open: z.boolean(),
  title: z.string().max(200),
  teamId: z.string().max(100).nullable(),
});
type Pending = z.infer<typeof pendingSchema>;

const pendingStore = persistedState({ version: 1, schema: pendingSchema });
const closed: Pending = { open: false, title: '', teamId: null };

type Errors = { title?: string; team?: string; form?: string };

/**
 * "Save to a notebook" on the scratch workbench: a title and a team, then the design as typed
 * becomes version 1 of a new notebook, which opens. Signed out, it goes to sign-in first and the
 * panel comes back open, with what was typed, on the return.
 */
export function SaveToNotebook({ result }: { result: FormResult }) {
  const router = useRouter();
  const here = usePathname();
  const session = useSessionQuery();
  const user = session.data?.user ?? null;
  const [pending, setPending] = useState<Pending>(() => pendingStore.read(SAVE_TO_NOTEBOOK_KEY) ?? closed);
  const [errors, setErrors] = useState<Errors>({});

  const update = (next: Pending) => {
    setPending(next);
    if (next.open) pendingStore.write(SAVE_TO_NOTEBOOK_KEY, next);
    else pendingStore.remove(SAVE_TO_NOTEBOOK_KEY);
  };
  // Replaced, not pushed: sign-in brings a fresh workbench back, and a second one must not wait below.
  const toSignIn = (state: Pending) => {
    update({ ...state, open: true });
    router.replace(`/sign-in?next=${encodeURIComponent(here)}` as Href);
  };
  // The server said the session is over: sign-in must not take the cached session for a live one.
  const sessionEnded = async (state: Pending) => {
    update({ ...state, open: true });
    await session.refetch();
    toSignIn(state);
  };

  if (!pending.open) {
    return (
      <View style={styles.row}>
        <Button
          kind="secondary"
          label="Save to a notebook"
          disabled={session.isPending}
          onPress={() => (user ? update({ ...pending, open: true }) : toSignIn(pending))}
          testID="save-to-notebook"
        />
      </View>
    );
  }
  if (!user) {
    // The panel was left open by someone who is now signed out (the session ended).
    return (
      <Card title="Save to a notebook" testID="save-to-notebook-panel">
        <Text>Notebooks belong to teams: sign in to keep this design in one. Your design and title stay here.</Text>
        <View style={styles.row}>
          <Button label="Sign in to save" onPress={() => toSignIn(pending)} testID="save-to-notebook-sign-in" />
          <Button kind="quiet" label="Cancel" onPress={() => update(closed)} />
        </View>
      </Card>
    );
  }
  return <SavePanel result={result} pending={pending} update={update} errors={errors} setErrors={setErrors} onSignedOut={(state) => void sessionEnded(state)} />;
}

type PanelProps = {
  result: FormResult;
  pending: Pending;
  update: (next: Pending) => void;
  errors: Errors;
  setErrors: (errors: Errors) => void;
  onSignedOut: (state: Pending) => void;
};

function SavePanel({ result, pending, update, errors, setErrors, onSignedOut }: PanelProps) {
  const router = useRouter();
  const teams = useTeamsQuery();
  // New designs go only where the user may edit: other teams would refuse them.
  const writable = (teams.data ?? []).filter((team) => can(team.role, 'designs.edit'));
  const onlyTeam = writable.length === 1 ? writable[0]!.id : null;
  const teamId = writable.some((team) => team.id === pending.teamId) ? pending.teamId : onlyTeam;
  const create = useCreateDesignMutation(teamId ?? '');

  const submit = async () => {
    const found: Errors = {};
    const title = designTitleSchema.safeParse(pending.title);
    if (!title.success) found.title = `Title ${title.error.issues[0]?.message ?? 'is not valid'}`;
    if (!teamId) found.team = 'Team: choose the team that keeps the notebook';
    if (!result.ok) {
      const fields = Object.keys(result.fields).map(fieldLabel).join(', ');
      found.form = `The workbench refuses ${fields || 'some fields'}: fix them first, and save then.`;
    }
    setErrors(found);
    if (!title.success || !teamId || !result.ok) return;
    try {
      const made = await create.mutateAsync({ title: title.data, params: result.design, message: 'First version, from the workbench' });
      update(closed);
      router.push(`/notebooks/${made.design.id}` as Href);
    } catch (failure) {
      if (failure instanceof ApiError && failure.status === 401) {
        onSignedOut(pending);
        return;
      }
      const fields = failure instanceof ApiError ? failure.fields : {};
      setErrors({
        title: fields.title ? `Title ${fields.title}` : undefined,
        form: fields.title ? undefined : failure instanceof Error ? failure.message : 'The notebook could not be created.',
      });
    }
  };

  return (
    <Card title="Save to a notebook" testID="save-to-notebook-panel">
      <Text tone="muted" variant="small">
        The design as it is now becomes version 1 of a new notebook in the team you choose.
      </Text>
      <TextField
        label="Title"
        value={pending.title}
        onChangeText={(title) => update({ ...pending, title })}
        placeholder="e.g. Sodium doublet monochromator"
        maxLength={120}
        error={errors.title ?? null}
        onSubmitEditing={() => void submit()}
        testID="save-to-notebook-title"
      />
      {teams.data ? (
        <View style={styles.group}>
          <RadioGroup
            label="Team"
            showLabel
            options={writable.map((team) => ({ value: team.id, label: team.personal ? 'Personal workspace' : team.name }))}
            value={teamId}
            onChange={(next) => update({ ...pending, teamId: next })}
            testID="save-to-notebook-team"
          />
          {writable.length < teams.data.length ? (
            <Text variant="small" tone="muted">
              Only teams where you are an owner take new designs.
            </Text>
          ) : null}
          {errors.team ? (
            <Text role="alert" tone="danger" weight="semibold" testID="save-to-notebook-team-error">
              {errors.team}
            </Text>
          ) : null}
        </View>
      ) : (
        <Text tone={teams.isError ? 'danger' : 'muted'}>{teams.isError ? teams.error.message : 'Loading your teams…'}</Text>
      )}
      {errors.form ? (
        <Text role="alert" tone="danger" weight="semibold" testID="save-to-notebook-error">
          {errors.form}
        </Text>
      ) : null}
      <View style={styles.row}>
        <Button label={create.isPending ? 'Creating…' : 'Create notebook'} onPress={() => void submit()} disabled={create.isPending} testID="create-notebook-from-workbench" />
        <Button kind="quiet" label="Cancel" onPress={() => (setErrors({}), update(closed))} testID="save-to-notebook-cancel" />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  group: { gap: space.xs },
});
