import { useRouter, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { Button, Card, Heading, Screen, Text, colors, space, useDocumentTitle, useLayout } from '@/features/ui';
import { TextLink, useSessionQuery } from '@/features/auth';
import { useHealthQuery } from '@/features/health';

const steps = [
  {
    title: 'State the requirement',
    body: 'Wavelength range, bandpass or resolving power, light source and detector.',
  },
  {
    title: 'Shape the instrument',
    body: 'Grating, order and blaze; Czerny–Turner, Littrow or Ebert–Fastie mount; slits and focal lengths.',
  },
  {
    title: 'Check every wavelength',
    body: 'Dispersion, bandpass, efficiency, overlapping orders and scan rotation across the whole range, computed as you type.',
  },
  {
    title: 'Keep the reasoning',
    body: 'Versioned notebooks per team: notes with each version, reviews, clones of a shared baseline, a design sheet for the manager.',
  },
];

function ServerStatus() {
  const health = useHealthQuery();
  const [tone, label] = health.isPending
    ? (['muted', 'Checking the notebook server…'] as const)
    : health.isError
      ? (['danger', 'Notebook server unreachable: designs cannot be saved right now.'] as const)
      : health.data.database.ok
        ? (['ok', `Notebook server ready · version ${health.data.version}`] as const)
        : (['warning', 'Notebook server is up but its database is not answering.'] as const);
  return (
    <View style={styles.status} testID="server-status">
      <View style={[styles.dot, { backgroundColor: colors[tone === 'muted' ? 'inkFaint' : tone] }]} />
      <Text variant="small" tone={tone}>
        {label}
      </Text>
    </View>
  );
}

/** First screen: what Blazebook is for, and whether its server is reachable. */
export function LandingScreen() {
  const layout = useLayout();
  const router = useRouter();
  const session = useSessionQuery();
  useDocumentTitle('Grating instrument design');
  return (
    <Screen>
      <View style={styles.hero}>
        <Text variant="caption" tone="muted" style={styles.kicker}>
          GRATING INSTRUMENT DESIGN
        </Text>
        <Heading level={1} testID="landing-heading">
          Design monochromators you can defend.
        </Heading>
        <Text variant="lead" tone="muted">
          Blazebook turns a spectral requirement into a grating, a mount and a pair of slits, checks it
          across the whole range while you type, and keeps every version with its reasoning for your
          team.
        </Text>
        <ServerStatus />
        <View style={styles.actions}>
          <Button label="Open the workbench" onPress={() => router.push('/workbench')} testID="open-workbench" />
          <Button kind="secondary" label="Team notebooks" onPress={() => router.push('/notebooks' as Href)} testID="open-notebooks" />
          <Button
            kind="secondary"
            label="Filters and prisms"
            onPress={() => router.push('/selectors' as Href)}
            testID="open-selectors"
          />
        </View>
        {session.data?.user ? null : (
          <View style={styles.signUp}>
            <Text tone="muted">New here? The workbench needs no account; notebooks do.</Text>
            <TextLink href={'/sign-up' as Href} label="Create an account" testID="landing-sign-up" />
          </View>
        )}
      </View>
      <View style={[styles.grid, layout !== 'phone' && styles.gridWide]}>
        {steps.map((step, index) => (
          <Card key={step.title} style={layout !== 'phone' ? styles.cell : undefined}>
            <Text variant="number" tone="muted">
              {String(index + 1).padStart(2, '0')}
            </Text>
            <Heading level={3}>{step.title}</Heading>
            <Text tone="muted">{step.body}</Text>
          </Card>
        ))}
      </View>
      <Card>
        <Text variant="small" tone="muted">
          Safety: mercury and deuterium lamps emit ultraviolet light that harms eyes and skin, lamp
          supplies run at high voltage, and lasers need your site’s laser-safety rules. Blazebook’s
          numbers do not replace your local codes or your licensed safety officer.
        </Text>
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  hero: { gap: space.md, paddingVertical: space.xl },
  kicker: { letterSpacing: 1.5 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, paddingTop: space.sm },
  signUp: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', gap: space.xs },
  status: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  dot: { width: 10, height: 10, borderRadius: 5 },
  grid: { gap: space.lg },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  cell: { flexBasis: '45%', flexGrow: 1 },
});
