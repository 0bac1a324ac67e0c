import { useQuery } from '@tanstack/react-query';
import { healthQuery, type ServiceState } from '../api/health';

const LABEL: Record<ServiceState | 'checking', string> = {
  checking: 'checking sync service…',
  online: 'sync service online',
  degraded: 'sync service degraded — working locally',
  offline: 'offline — working locally',
};

export function ServiceStatus() {
  const { data } = useQuery(healthQuery);
  const state = data ?? 'checking';
  const dot = state === 'online' ? 'bg-teal' : state === 'checking' ? 'bg-muted' : 'bg-stressed';
  return (
    <span
      data-testid="service-status"
      data-state={state}
      className="inline-flex items-center gap-2 text-sm text-muted"
      aria-live="polite"
    >
      <span className={`h-2 w-2 rounded-full ${dot}`} aria-hidden="true" />
      {LABEL[state]}
    </span>
  );
}
