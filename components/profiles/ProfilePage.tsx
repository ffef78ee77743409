import type { ProfileDetail } from '../../schemas/profiles';
import { SplitColumns } from '../layout/SplitColumns';
import { Card } from '../ui/Card';
import { SectionHeading } from '../ui/SectionHeading';
import { BuildUse } from './BuildUse';
import type { ProfileDiffQuery } from '../../hooks/useProfiles';
import { VersionDiff, type DiffPick } from './VersionDiff';
import { VersionList } from './VersionList';

/** One character's profile: versions and downloads, what changed, and how a build uses it. Wide: two columns. */
export function ProfilePage({ detail, mayManageTokens, diffPick, onDiffPick, diff }: { detail: ProfileDetail; mayManageTokens: boolean; diffPick: DiffPick; onDiffPick(pick: DiffPick): void; diff: ProfileDiffQuery }) {
  const { profile, versions } = detail;
  const fileName = `${profile.character.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.leg-profile.json`;
  return (
    <SplitColumns
      main={
        <>
          <Card>
            <SectionHeading>Versions</SectionHeading>
            <VersionList profileId={profile.id} characterName={profile.character.name} versions={versions} />
          </Card>
          <Card>
            <SectionHeading>What changed</SectionHeading>
            <VersionDiff versions={versions} pick={diffPick} onPick={onDiffPick} diff={diff} />
          </Card>
        </>
      }
      side={
        <Card>
          <SectionHeading>Use it in a build</SectionHeading>
          <BuildUse profileId={profile.id} fileName={fileName} mayManageTokens={mayManageTokens} />
        </Card>
      }
    />
  );
}
