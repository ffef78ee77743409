import type { Character } from '../../schemas/characters';
import { RecordList, type RecordColumn } from '../ui/RecordList';
import { formatDay } from '../ui/format';
import { formatBytes } from './format';

const COLUMNS = [
  { key: 'name', label: 'Name', flex: 3, numeric: false },
  { key: 'legs', label: 'Legs', flex: 1, numeric: true },
  { key: 'joints', label: 'Joints', flex: 1, numeric: true },
  { key: 'size', label: 'File size', flex: 1.4, numeric: true },
  { key: 'by', label: 'Uploaded by', flex: 2.2, numeric: false },
  { key: 'when', label: 'When', flex: 1.6, numeric: true },
] as const satisfies readonly RecordColumn<string>[];

/** The team's characters: a card each on a phone, one table on a wide screen. */
export function CharacterList({ characters }: { characters: Character[] }) {
  return (
    <RecordList
      label="Characters"
      items={characters}
      idOf={(c) => c.id}
      nameOf={(c) => c.name}
      hrefOf={(c) => `/characters/${c.id}`}
      columns={COLUMNS}
      cells={(c) => ({
        name: c.name,
        legs: String(c.legCount),
        joints: String(c.jointCount),
        size: formatBytes(c.byteSize),
        by: c.uploadedBy.name,
        when: formatDay(c.createdAt),
      })}
      figures={(c) => [
        { label: 'legs', value: String(c.legCount) },
        { label: 'joints', value: String(c.jointCount) },
        { label: 'file', value: formatBytes(c.byteSize) },
      ]}
      meta={(c) => `${c.uploadedBy.name} · ${formatDay(c.createdAt)}`}
    />
  );
}
