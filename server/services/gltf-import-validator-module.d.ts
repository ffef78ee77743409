/** Types for the Khronos `gltf-validator` package, which ships none (shape per its validation.schema.json). */
declare module 'gltf-validator' {
  export interface ValidatorMessage {
    code: string;
    severity: 0 | 1 | 2 | 3;
    message: string;
    pointer?: string;
    offset?: number;
  }
  export interface ValidatorReport {
    uri?: string;
    mimeType?: string;
    validatorVersion: string;
    issues: { numErrors: number; numWarnings: number; numInfos: number; numHints: number; messages: ValidatorMessage[]; truncated: boolean };
    info?: Record<string, unknown>;
  }
  export interface ValidationOptions {
    uri?: string;
    format?: 'gltf' | 'glb';
    maxIssues?: number;
    ignoredIssues?: string[];
    externalResourceFunction?: (uri: string) => Promise<Uint8Array>;
    writeTimestamp?: boolean;
  }
  export function version(): string;
  export function supportedExtensions(): string[];
  export function validateBytes(data: Uint8Array, options?: ValidationOptions): Promise<ValidatorReport>;
  export function validateString(json: string, options?: ValidationOptions): Promise<ValidatorReport>;
}
