/** The Sketch feature: a scenario edited with its smiles drawn live. */
export { SketchPage } from './components/SketchPage';
