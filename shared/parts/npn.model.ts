export { npnModel } from './bjt.model';
