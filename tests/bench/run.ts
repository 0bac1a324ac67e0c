/**
 * `npm run bench`: speed against a peer measured in the same run on the same machine. Prints
 * ratios, never pass/fail: machines are shared and noisy, so targets live here, not in tests.
 */
import { benchBook } from './book';
import { benchCalibration } from './calibration';
import { benchChainFit } from './chain-fit';
import { benchMonteCarlo } from './monte-carlo';
import { benchReplay } from './replay';
import { benchScheduledMoves } from './scheduled-moves';
import { benchSketchBrowser } from './sketch-browser';
import { benchSvcj } from './svcj';
import { benchSurface } from './surface';
import { benchSync } from './sync';

console.log(`Saltation benchmarks — Node ${process.versions.node}, one core\n`);
console.log(
  'Pricing surface (COS + implied vols) vs @quantlib/ql analytic engines; QuantLib time is pricing only.',
);
console.table(benchSurface());

console.log('\nScheduled moves and a jump-intensity schedule: the same work with and without.');
console.table(benchScheduledMoves());

console.log('\nSVCJ (jumps in price and variance) against Bates, the same options.');
console.table(benchSvcj());

console.log('\nBook revaluation with the gap ladder, one thread (as in one worker).');
console.table(benchBook());

console.log('\nCalibration to a 13 × 8 surface with noise, one thread.');
console.table(benchCalibration());

console.log(
  '\nFit on a chain with bid and ask (8 expiries × 40 strikes × calls and puts), one thread.',
);
console.table(benchChainFit());

console.log('\nMonte Carlo, Bates with QE variance and jumps.');
console.table(await benchMonteCarlo());

console.log('\nHedge replay: 10,000 paths, daily rebalancing over one month, two legs, one core.');
console.table(await benchReplay());

console.log(
  '\nSync service on loopback (autocannon, 10 connections, 5 s each; its own PostgreSQL and service process).',
);
console.table(await benchSync());

console.log(
  '\nSketch in headless Chromium: stress sliders moved by key presses, input to painted smile panels.',
);
console.table(await benchSketchBrowser());
