import { PagePlaceholder } from '../components/PagePlaceholder';

export function PathsPage() {
  return (
    <PagePlaceholder title="Paths">
      <p>
        Simulate a scenario&apos;s jump-diffusion paths (Andersen QE variance, compound-Poisson
        jumps) in background workers, with a seed that reproduces every number on any machine: fans
        of spot and variance, jump counts and sizes, and Monte Carlo prices against the analytic
        ones.
      </p>
    </PagePlaceholder>
  );
}
