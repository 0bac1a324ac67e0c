import { describe, expect, it } from 'vitest';
import { cosPrice, heston, lewisPrice, market } from './helpers';

// Every value here is listed, with its source, in the project's reference table (README, "Checks").
describe('Heston prices against published references', () => {
  const fo = heston(1.5768, 0.0398, 0.5751, -0.5711, 0.0175);

  it('Fang & Oosterlee 2008 Table 4: call K=100, T=1 is 5.785155450 (high-precision 5.7851554344)', () => {
    // The published figure is 1.6e-8 above high-precision quadrature.
    expect(Math.abs(cosPrice(market(100), fo, 'call', 100, 1) - 5.78515545)).toBeLessThan(5e-8);
    expect(Math.abs(cosPrice(market(100), fo, 'call', 100, 1) - 5.7851554344)).toBeLessThan(1e-9);
    expect(Math.abs(lewisPrice(market(100), fo, 'call', 100, 1) - 5.7851554344)).toBeLessThan(1e-9);
  });

  it('Fang & Oosterlee 2008 Table 5: call K=100, T=10 is 22.318945791', () => {
    expect(Math.abs(cosPrice(market(100), fo, 'call', 100, 10) - 22.318945791)).toBeLessThan(1e-8);
    expect(Math.abs(lewisPrice(market(100), fo, 'call', 100, 10) - 22.318945791)).toBeLessThan(
      1e-8,
    );
  });

  it('Lewis reference prices (QuantLib test-suite hestonmodel.cpp) to 1e-10', () => {
    const m = market(100, 0.01, 0.02);
    const lw = heston(4, 0.25, 1, -0.5, 0.04);
    const table: [number, number, number][] = [
      [80, 7.958878113256768, 26.774758743998856],
      [90, 12.017966707346305, 20.93334900059671],
      [100, 17.05527096127011, 16.070154917028834],
      [110, 23.0178258984428, 12.132211516709845],
      [120, 29.811026202682473, 9.024913483457835],
    ];
    for (const [K, put, call] of table) {
      expect(Math.abs(cosPrice(m, lw, 'put', K, 1) - put)).toBeLessThan(1e-10);
      expect(Math.abs(cosPrice(m, lw, 'call', K, 1) - call)).toBeLessThan(1e-10);
      expect(Math.abs(lewisPrice(m, lw, 'call', K, 1) - call)).toBeLessThan(1e-10);
    }
  });

  it('QuantLib testAllIntegrationMethods: put K=100 is 10.147041515497', () => {
    const m = market(100, 0.05, 0.075);
    expect(
      Math.abs(cosPrice(m, heston(4, 0.05, 0.4, -0.75, 0.1), 'put', 100, 1) - 10.147041515497),
    ).toBeLessThan(1e-10);
  });

  it('QuantLib testCosHestonEngine: deep wings in absolute and relative terms', () => {
    const m = market(100, 0.15, 0.07);
    const p = heston(4, 0.22, 1.8, -0.75, 0.1);
    expect(Math.abs(cosPrice(m, p, 'call', 120, 1) - 9.364410588426075)).toBeLessThan(1e-10);
    expect(Math.abs(cosPrice(m, p, 'put', 80, 1) - 5.319092971836708)).toBeLessThan(1e-10);
    // tiny prices: relative check against the integration pricer as well as the reference
    expect(Math.abs(cosPrice(m, p, 'call', 250, 1) / 0.01036797658132471 - 1)).toBeLessThan(1e-9);
    expect(Math.abs(cosPrice(m, p, 'put', 10, 1) / 0.01032681906278383 - 1)).toBeLessThan(1e-9);
    expect(Math.abs(lewisPrice(m, p, 'put', 10, 1) / 0.01032681906278383 - 1)).toBeLessThan(1e-9);
  });

  it('Kahl & Jäckel 2005 (via QuantLib): call K=200, T=10 is 4.9521147 — the original form gives 4.379', () => {
    const kj = heston(1, 0.16, 2, -0.8, 0.16);
    expect(Math.abs(cosPrice(market(100), kj, 'call', 200, 10) - 4.9521147209)).toBeLessThan(1e-9);
    expect(Math.abs(lewisPrice(market(100), kj, 'call', 200, 10) - 4.9521147209)).toBeLessThan(
      1e-9,
    );
  });

  it('Andersen 2008 Case I (T=10): calls K=60/70/100/140 — catches the branch-cut error (18.17 at K=100)', () => {
    const a = heston(0.5, 0.04, 1.0, -0.9, 0.04);
    const table: [number, number][] = [
      [60, 44.32997507],
      [70, 35.8497697],
      [100, 13.08467014],
      [140, 0.29577444],
    ];
    // references are printed to 1e-8 (1e-7 for K=70)
    for (const [K, v] of table)
      expect(Math.abs(cosPrice(market(100), a, 'call', K, 10) - v)).toBeLessThan(1.5e-7);
  });

  it('Andersen 2008 Case II (T=15): calls 45.28686 / 16.64922 / 5.13819', () => {
    const a = heston(0.3, 0.04, 0.9, -0.5, 0.04);
    const table: [number, number][] = [
      [60, 45.28686],
      [100, 16.64922],
      [140, 5.13819],
    ];
    for (const [K, v] of table)
      expect(Math.abs(cosPrice(market(100), a, 'call', K, 15) - v)).toBeLessThan(1e-5);
  });

  it('Broadie & Kaya 2006 cases 1 and 2, and van Haastrecht & Pelsser 2010 (Andersen Case III, r=5%)', () => {
    expect(
      Math.abs(
        cosPrice(market(100, 0.0319), heston(6.21, 0.019, 0.61, -0.7, 0.010201), 'call', 100, 1) -
          6.80611331,
      ),
    ).toBeLessThan(1e-8);
    const bk2 = heston(2, 0.09, 1, -0.3, 0.09);
    expect(Math.abs(cosPrice(market(100, 0.05), bk2, 'call', 100, 5) - 34.99975835)).toBeLessThan(
      1e-8,
    );
    const c3 = heston(1, 0.09, 1, -0.3, 0.09);
    const vh: [number, number][] = [
      [60, 56.575],
      [100, 33.597],
      [140, 18.157],
    ];
    for (const [K, v] of vh)
      expect(Math.abs(cosPrice(market(100, 0.05), c3, 'call', K, 5) - v)).toBeLessThan(1e-3);
  });

  it('BENCHOP Problem 4 (von Sydow et al. 2015): calls at S0 = 90/100/110', () => {
    const b = heston(2, 0.0225, 0.25, -0.5, 0.0225);
    const table: [number, number][] = [
      [90, 2.302535842814927],
      [100, 7.379832496149447],
      [110, 14.974005277144057],
    ];
    for (const [S, v] of table)
      expect(Math.abs(cosPrice(market(S, 0.03), b, 'call', 100, 1) - v)).toBeLessThan(1e-10);
  });
});
