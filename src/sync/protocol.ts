/** The sync messages (from the contracts module) and the transport the sync engine pushes through. */
import type { MutationResult, PullAnswer, PushMutation } from '../contracts';

export type {
  MutationResult,
  PullAnswer,
  PulledChange,
  PulledSet,
  PushMutation,
  ServerCopy,
} from '../contracts';

export interface SyncTransport {
  push(mutations: PushMutation[]): Promise<{ results: MutationResult[] }>;
  pull(since: string): Promise<PullAnswer>;
}
