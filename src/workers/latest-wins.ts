/**
 * A channel to a worker for requests that go stale: at most one is in the worker at a time, the
 * others wait here, and a waiting request whose caller has given up (its AbortSignal fired, as
 * TanStack Query does when a slider has moved on and nobody watches the old key) is dropped
 * before it reaches the worker. During a drag only the newest position is computed next.
 */
export function latestWins<Req, Res>(send: (request: Req) => Promise<Res>) {
  interface Job {
    request: Req;
    signal?: AbortSignal;
    resolve: (r: Res) => void;
    reject: (e: unknown) => void;
  }
  const waiting: Job[] = [];
  let busy = false;

  const pump = async () => {
    if (busy) return;
    const job = waiting.shift();
    if (!job) return;
    busy = true;
    try {
      job.resolve(await send(job.request));
    } catch (e) {
      job.reject(e);
    } finally {
      busy = false;
      void pump();
    }
  };

  return (request: Req, signal?: AbortSignal): Promise<Res> =>
    new Promise<Res>((resolve, reject) => {
      if (signal?.aborted) return reject(signal.reason);
      const job: Job = { request, signal, resolve, reject };
      signal?.addEventListener(
        'abort',
        () => {
          const i = waiting.indexOf(job);
          if (i >= 0) {
            waiting.splice(i, 1);
            reject(signal.reason);
          }
        },
        { once: true },
      );
      waiting.push(job);
      void pump();
    });
}
