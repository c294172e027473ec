export * from './decimal';
export * from './callout-types';
export { parseCallout, calloutLimits } from './callout';
export { formatCallout, formatWrittenValue } from './callout-format';
