/** Input the engine cannot analyse; the message says what to fix, in one sentence. */
export class AnalysisInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AnalysisInputError';
  }
}
