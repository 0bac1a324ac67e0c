/**
 * The service's live-update stream (`/api/sync/events`): each "change" event means a space this
 * user can see changed, and the sync loop pulls at once. The stream is opened only after a
 * successful sync (so the service is known to answer) and closed on the first error: the loop's
 * polling carries on, and the next successful round opens it again. Nothing is logged when the
 * service is away.
 */
let source: EventSource | null = null;

export function openLiveEvents(onChange: () => void): void {
  if (source || typeof EventSource === 'undefined') return;
  const es = new EventSource('/api/sync/events');
  es.addEventListener('change', () => onChange());
  es.onerror = () => {
    es.close();
    if (source === es) source = null;
  };
  source = es;
}

export function closeLiveEvents(): void {
  source?.close();
  source = null;
}

/** Whether a stream is open (for the status line and the tests). */
export const liveEventsOpen = () => source !== null && source.readyState !== EventSource.CLOSED;
