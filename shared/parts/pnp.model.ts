export { pnpModel } from './bjt.model';
