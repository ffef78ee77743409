import type { CourseSummary } from '../../schemas/courses';
import { RecordList, type RecordColumn } from '../ui/RecordList';
import { formatLocalDay as formatDay } from '../setup/local-dates';

const relief = (c: CourseSummary) => `${(c.maxHeight - c.minHeight).toFixed(2)} m`;
const kinds = (c: CourseSummary) => (c.generatorKinds.length ? c.generatorKinds.join(', ') : 'uploaded');
const metres = (m: number) => `${m.toFixed(2)} m`;

const COLUMNS = [
  { key: 'name', label: 'Name', flex: 3, numeric: false },
  { key: 'made', label: 'Made from', flex: 2.4, numeric: false },
  { key: 'length', label: 'Length', flex: 1.2, numeric: true },
  { key: 'width', label: 'Width', flex: 1.1, numeric: true },
  { key: 'relief', label: 'Relief', flex: 1.1, numeric: true },
  { key: 'version', label: 'Version', flex: 1, numeric: true },
  { key: 'when', label: 'Saved', flex: 1.5, numeric: true },
] as const satisfies readonly RecordColumn<string>[];

/** The team's courses: a card each on a phone, one table on a wide screen. */
export function CourseList({ courses }: { courses: CourseSummary[] }) {
  return (
    <RecordList
      label="Courses"
      items={courses}
      idOf={(c) => c.id}
      nameOf={(c) => c.name}
      hrefOf={(c) => `/courses/${c.id}`}
      columns={COLUMNS}
      cells={(c) => ({
        name: c.name,
        made: kinds(c),
        length: metres(c.length),
        width: metres(c.width),
        relief: relief(c),
        version: String(c.version),
        when: formatDay(c.updatedAt),
      })}
      figures={(c) => [
        { label: 'long', value: metres(c.length) },
        { label: 'wide', value: metres(c.width) },
        { label: 'relief', value: relief(c) },
        { label: 'version', value: String(c.version) },
      ]}
      meta={(c) => `${kinds(c)} · ${c.updatedBy.name} · ${formatDay(c.updatedAt)}`}
    />
  );
}
