// One error type for the engine so API routes can map it to a 400 naming the field.
export class EngineError extends Error {
  readonly code = 'ENGINE_INPUT';
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'EngineError';
  }
}
