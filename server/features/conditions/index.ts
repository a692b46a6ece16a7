// The conditions feature as other features see it: import from here, never from its files.
export { Condition } from './model';
export { conditionsOpenDuring, presentConditions } from './service';
