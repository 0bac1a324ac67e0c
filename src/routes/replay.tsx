import { PagePlaceholder } from '../components/PagePlaceholder';

export function ReplayPage() {
  return (
    <PagePlaceholder title="Replay">
      <p>
        Delta-hedge a position over simulated paths — no hedge, Black-Scholes delta or the
        model&apos;s own delta — and see the P&amp;L distribution, VaR and expected shortfall, and
        how much of the loss came on steps with a jump. A saved run replays bit for bit.
      </p>
    </PagePlaceholder>
  );
}
