/**
 * The service's live-update stream (`/api/sync/events`): each "change" event means a space this
 * user can see changed, and the sync loop pulls at once. The stream is opened only after a
 * successful sync (so the service is known to answer) and closed on the first error: the loop's
 * polling carries on, and the next successful round opens it again. Nothing is logged when the
 * service is away.
 */
let source: EventSource | null = null;
let failures = 0;
let notBefore = 0;
let onLive: (live: boolean) => void = () => undefined;

/**
 * Opens the stream unless one is open or a failed one asks for patience: after a failure it
 * waits 20 s, 40 s, … up to 10 min (a proxy that refuses streams is not asked every round).
 */
export function openLiveEvents(onChange: () => void, live: (open: boolean) => void): void {
  onLive = live;
  if (source || typeof EventSource === 'undefined' || Date.now() < notBefore) return;
  const es = new EventSource('/api/sync/events');
  es.addEventListener('ready', () => {
    failures = 0;
    onLive(true);
  });
  es.addEventListener('change', () => onChange());
  es.onerror = () => {
    es.close();
    if (source === es) source = null;
    onLive(false);
    failures++;
    notBefore = Date.now() + Math.min(600_000, 20_000 * 2 ** (failures - 1));
  };
  source = es;
}

export function closeLiveEvents(): void {
  source?.close();
  source = null;
  onLive(false);
}
