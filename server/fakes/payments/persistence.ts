import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';

/**
 * The fake payment service's own SQLite file (never Treadle's database): every object as JSON by collection and
 * id, and a few counters. Written through on each change, so a restart finds subscriptions where they were.
 */
export class FakeStateFile {
  private readonly db: Database.Database;
  private readonly putStmt: Database.Statement;
  private readonly metaStmt: Database.Statement;
  /** A file made for this run only (no file was named): removed again by close(). */
  private readonly scratchDir: string | null;

  constructor(file?: string) {
    this.scratchDir = file ? null : fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-payments-'));
    const target = file ?? path.join(this.scratchDir!, 'payments.sqlite');
    fs.mkdirSync(path.dirname(target), { recursive: true });
    this.db = new Database(target);
    this.db.pragma('journal_mode = WAL');
    this.db.pragma('busy_timeout = 5000');
    this.db.exec(`
      create table if not exists objects (collection text not null, id text not null, body text not null, primary key (collection, id));
      create table if not exists meta (key text primary key, value text not null);
    `);
    this.putStmt = this.db.prepare('insert into objects (collection, id, body) values (?, ?, ?) on conflict (collection, id) do update set body = excluded.body');
    this.metaStmt = this.db.prepare('insert into meta (key, value) values (?, ?) on conflict (key) do update set value = excluded.value');
  }

  load<T extends { id: string }>(collection: string): Map<string, T> {
    const rows = this.db.prepare('select id, body from objects where collection = ? order by rowid').all(collection) as { id: string; body: string }[];
    return new Map(rows.map((r) => [r.id, JSON.parse(r.body) as T]));
  }

  put(collection: string, object: { id: string }): void {
    this.putStmt.run(collection, object.id, JSON.stringify(object));
  }

  meta(key: string): string | undefined {
    return (this.db.prepare('select value from meta where key = ?').get(key) as { value: string } | undefined)?.value;
  }

  setMeta(key: string, value: string): void {
    this.metaStmt.run(key, value);
  }

  close(): void {
    this.db.close();
    if (this.scratchDir) fs.rmSync(this.scratchDir, { recursive: true, force: true });
  }
}

/** A Map that writes every set() through to its collection in the state file. */
export class KeptMap<T extends { id: string }> extends Map<string, T> {
  constructor(
    private readonly file: FakeStateFile,
    private readonly collection: string,
  ) {
    super(file.load<T>(collection));
  }

  override set(id: string, value: T): this {
    // Map's constructor calls set() before the fields exist; those entries come from the file already.
    if (this.file) this.file.put(this.collection, value);
    return super.set(id, value);
  }

  /** Writes an object changed in place. */
  keep(value: T): void {
    this.set(value.id, value);
  }
}
