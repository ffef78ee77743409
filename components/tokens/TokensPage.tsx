import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { ApiToken, ApiTokenList, CreatedToken } from '../../schemas/tokens';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import type { Mutation, QueryState } from '../../hooks/mutation';
import type { CreateTokenInput } from '../../schemas/tokens';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { TextField } from '../ui/TextField';
import { formatDay, formatMoment } from '../ui/format';
import { CopyBlock } from '../profiles/CopyBlock';

function NewToken({ create }: { create: Mutation<CreateTokenInput, CreatedToken> }) {
  const [name, setName] = useState('');
  const [made, setMade] = useState<CreatedToken | null>(null);
  return (
    <Card>
      <SectionHeading>New token</SectionHeading>
      <Text style={styles.body}>A token reads characters and leg profiles and runs the regression check. It cannot change anything.</Text>
      <TextField label="Name" value={name} onChangeText={setName} placeholder="e.g. CI build" error={create.error?.fields.name} hint="Say where it is used, so you know what breaks when you revoke it." />
      {create.error && !create.error.fields.name ? <Notice message={create.error.message} /> : null}
      <Button
        label="Create token"
        busy={create.isPending}
        onPress={() =>
          create.mutate(
            { name },
            {
              onSuccess: (r) => {
                setMade(r);
                setName('');
              },
            },
          )
        }
      />
      {made ? (
        <View style={styles.secret} role="status">
          <Text style={styles.secretTitle}>Copy “{made.token.name}” now: it is shown only this once.</Text>
          <Text style={styles.body}>Treadle keeps only a fingerprint of it. Store it in your CI's secret store; if it leaks, revoke it below.</Text>
          <CopyBlock label="API token" text={made.secret} />
          <Button label="I have stored it" tone="quiet" onPress={() => setMade(null)} />
        </View>
      ) : null}
    </Card>
  );
}

function TokenRow({ token, revoke }: { token: ApiToken; revoke: Mutation<number, { token: ApiToken }> }) {
  // One revoke serves every row: a row shows only its own token's progress and failure.
  const mine = revoke.variables === token.id;
  const [confirming, setConfirming] = useState(false);
  const revoked = token.revokedAt !== null;
  return (
    <View role="listitem" aria-label={token.name} style={[styles.row, revoked && styles.revoked]}>
      <View style={styles.rowText}>
        <Text style={styles.name}>{token.name}</Text>
        <Text style={styles.meta}>
          {token.createdBy.name} · made {formatDay(token.createdAt)} · {token.lastUsedAt ? `last used ${formatMoment(token.lastUsedAt)}` : 'never used'}
        </Text>
        {revoked ? <Text style={styles.status}>✕ Revoked {formatDay(token.revokedAt!)}</Text> : <Text style={styles.active}>● Active</Text>}
      </View>
      {revoked ? null : confirming ? (
        <View style={styles.actions}>
          <Button label="Keep" tone="quiet" onPress={() => setConfirming(false)} />
          <Button label="Revoke now" tone="danger" busy={revoke.isPending && mine} accessibilityLabel={`Revoke ${token.name} now`} onPress={() => revoke.mutate(token.id)} />
        </View>
      ) : (
        <Button label="Revoke" tone="danger" accessibilityLabel={`Revoke ${token.name}`} onPress={() => setConfirming(true)} />
      )}
      {confirming && !revoked ? <Text style={styles.meta}>Builds using this token stop working at once.</Text> : null}
      {mine && revoke.error ? <Notice message={revoke.error.message} /> : null}
    </View>
  );
}

/** API tokens for build scripts: make one (shown once), see when each was last used, revoke. */
export function TokensPage({ tokens, create, revoke }: { tokens: QueryState<ApiTokenList>; create: Mutation<CreateTokenInput, CreatedToken>; revoke: Mutation<number, { token: ApiToken }> }) {
  const list = tokens.data?.tokens ?? [];
  return (
    <View style={styles.wrap}>
      <NewToken create={create} />
      <Card>
        <SectionHeading>Tokens</SectionHeading>
        {tokens.isError ? <Notice message={tokens.error.message} /> : null}
        {tokens.isSuccess && list.length === 0 ? <Text style={styles.body}>No tokens yet.</Text> : null}
        <View role="list" aria-label="API tokens" style={styles.list}>
          {list.map((t) => (
            <TokenRow key={t.id} token={t} revoke={revoke} />
          ))}
        </View>
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  body: { ...type.body, color: colors.graphite },
  secret: { gap: space.sm, borderLeftWidth: 4, borderLeftColor: colors.ember, backgroundColor: colors.paperDeep, borderRadius: radius.sm, padding: space.md },
  secretTitle: { fontFamily: fonts.bodyStrong, fontSize: 15, color: colors.ink },
  list: { gap: space.sm },
  row: { gap: space.sm, borderBottomWidth: 1, borderBottomColor: colors.rule, paddingVertical: space.sm },
  revoked: { opacity: 0.7 },
  rowText: { gap: 2 },
  name: { fontFamily: fonts.bodyStrong, fontSize: 16, color: colors.ink },
  meta: { ...type.small, color: colors.graphite },
  status: { ...type.small, color: colors.danger },
  active: { ...type.small, color: colors.moss },
  actions: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
});
