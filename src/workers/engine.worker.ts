import { expose } from 'comlink';
import { engineHandlers } from './engine-handlers';

expose(engineHandlers);
