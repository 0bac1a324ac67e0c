/** Cancellation of worker jobs through the platform's AbortController. */

export class CancelledError extends Error {
  constructor() {
    super('cancelled');
  }
}

/**
 * `work`, ended with a CancelledError as soon as `signal` aborts. `stop` (which terminates the
 * job's workers) runs either way, once the job has ended or been aborted.
 */
export function abortable<T>(work: Promise<T>, signal: AbortSignal, stop: () => void): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const abort = () => {
      stop();
      reject(new CancelledError());
    };
    if (signal.aborted) return abort();
    signal.addEventListener('abort', abort, { once: true });
    work.then(resolve, reject).finally(() => {
      signal.removeEventListener('abort', abort);
      stop();
    });
  });
}
