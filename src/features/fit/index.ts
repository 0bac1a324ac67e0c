/** The Fit feature: quotes uploaded and a model calibrated to them. */
export { FitPage } from './components/FitPage';
