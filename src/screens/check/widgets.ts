// The check screen's two pictures, in one chunk of their own that loads after the first paint
// (lazy-widgets.ts): the first screen's script stays small, and both arrive with one request.
export { Preview } from './preview';
export { RateMap } from '../../ui/rate-map';
