/** Runs the Khronos glTF validator (the reference implementation of the glTF 2.0 specification's rules) and keeps its report. */
import { createRequire } from 'node:module';
import type { ImportReport } from '../../schemas/characters';
import type { Container } from './gltf-import-container';

/** Issues kept in the report; the counts always cover all of them. */
export const MAX_REPORTED_ISSUES = 200;

const SEVERITY = ['error', 'warning', 'info', 'hint'] as const;

// The validator is several megabytes of compiled Dart: load it on the first upload, not whenever the app is built.
const nodeRequire = createRequire(__filename);
let validatorLib: typeof import('gltf-validator') | null = null;
const validator = () => (validatorLib ??= nodeRequire('gltf-validator') as typeof import('gltf-validator'));

export async function validateContainer(c: Container): Promise<ImportReport['validator']> {
  const bytes = new Uint8Array(c.main.buffer.buffer, c.main.buffer.byteOffset, c.main.buffer.byteLength);
  const report = await validator().validateBytes(bytes, {
    uri: c.main.originalname,
    format: c.format,
    maxIssues: MAX_REPORTED_ISSUES,
    writeTimestamp: false,
    externalResourceFunction: async (uri) => {
      const found = c.resources[uri] ?? c.resources[decodeURIComponent(uri)];
      if (!found) throw new Error(`not uploaded: ${uri}`);
      return found;
    },
  });
  const { issues } = report;
  return {
    version: report.validatorVersion,
    errors: issues.numErrors,
    warnings: issues.numWarnings,
    infos: issues.numInfos,
    hints: issues.numHints,
    issues: issues.messages.slice(0, MAX_REPORTED_ISSUES).map((m) => ({
      code: m.code,
      severity: SEVERITY[m.severity] ?? 'info',
      message: m.message,
      ...(m.pointer ? { pointer: m.pointer } : m.offset !== undefined ? { pointer: `byte ${m.offset}` } : {}),
    })),
    truncated: issues.truncated,
  };
}
