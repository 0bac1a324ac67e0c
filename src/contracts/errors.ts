/** The one shape of every refusal the service answers: a code, a reason, the bad field's path. */
export interface ErrorBody {
  error: { code: string; message: string; path?: string };
}
