/**
 * The owner's view of where trials and dial-ins run: inside the server (embedded threads) or on worker
 * processes over Redis, the workers connected, and the tasks waiting and running (the screen refreshes it).
 * The screen shows it to owners only.
 */
import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space, type } from '../../constants/theme';
import type { QueryState } from '../../hooks/mutation';
import type { QueueStatus as QueueStatusShape } from '../../schemas/queue';
import { Card } from '../ui/Card';
import { SectionHeading } from '../ui/SectionHeading';

function Figure({ label, value }: { label: string; value: number }) {
  return (
    <View style={styles.figure} accessibilityLabel={`${label}: ${value}`}>
      <Text style={styles.value}>{value}</Text>
      <Text style={styles.figureLabel}>{label}</Text>
    </View>
  );
}

export function QueueStatusSection({ status }: { status: QueryState<QueueStatusShape> }) {
  const s = status.data;
  return (
    <>
      <SectionHeading>Where trials and dial-ins run</SectionHeading>
      <Card testID="queue-status">
        {status.isError ? <Text style={styles.problem}>Could not read the queue: {status.error.message}</Text> : null}
        {!s ? (
          status.isError ? null : <Text style={styles.note}>Reading the queue…</Text>
        ) : (
          <>
            <Text style={styles.body}>
              {s.runner === 'redis'
                ? 'On worker processes over a shared Redis queue (REDIS_URL). Start `npm run worker` on another machine to add one.'
                : 'Inside the server, on its own threads. Set REDIS_URL and start `npm run worker` on other machines to spread the work.'}
            </Text>
            {s.problem ? <Text style={styles.problem}>{s.problem}</Text> : null}
            <View style={styles.figures}>
              <Figure label={s.runner === 'redis' ? 'workers connected' : 'threads'} value={s.workers.length} />
              <Figure label="tasks waiting" value={s.waiting} />
              <Figure label="tasks running" value={s.running} />
              <Figure label="your jobs queued" value={s.jobsQueued} />
              <Figure label="your jobs running" value={s.jobsRunning} />
            </View>
            {s.runner === 'redis' && s.workers.length === 0 ? (
              <Text style={styles.problem}>No worker is connected: queued trials and dial-ins wait until one starts.</Text>
            ) : null}
            {s.runner === 'redis' && s.workers.length > 0 ? (
              <View style={styles.list}>
                {s.workers.map((w, i) => (
                  <Text key={`${w.name}-${i}`} style={styles.worker}>
                    {w.name}
                    {w.address ? `  ·  ${w.address}` : ''}
                  </Text>
                ))}
              </View>
            ) : null}
          </>
        )}
      </Card>
    </>
  );
}

const styles = StyleSheet.create({
  body: { ...type.body, color: colors.ink },
  note: { ...type.small, color: colors.graphite },
  problem: { ...type.small, color: colors.danger },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  figure: { minWidth: 96, gap: 2 },
  value: { ...type.figure, fontSize: 22, lineHeight: 28, color: colors.ink },
  figureLabel: { ...type.small, color: colors.graphite },
  list: { gap: space.xs },
  worker: { fontFamily: fonts.mono, fontSize: 13, color: colors.ink },
});
