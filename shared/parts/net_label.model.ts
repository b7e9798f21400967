// A net label only names and joins nets: the same connector model as ground.
export { connectorModel as netLabelModel } from './ground.model';
