/** An error the fake answers in the provider's JSON error shape, which the SDK turns into its own error classes. */
export class FakeApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: 'invalid_request_error' | 'card_error' | 'api_error' | 'authentication_error',
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }
  body() {
    return { error: { type: this.type, message: this.message, ...(this.code ? { code: this.code } : {}), ...(this.param ? { param: this.param } : {}) } };
  }
}

export const missing = (what: string, id: string) => new FakeApiError(404, 'invalid_request_error', `No such ${what}: '${id}'`, 'resource_missing', 'id');
export const badParam = (param: string, message: string) => new FakeApiError(400, 'invalid_request_error', message, 'parameter_invalid', param);
