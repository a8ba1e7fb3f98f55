// Node-side file helpers: atomic writes.
export { writeFileAtomic } from './atomicWrite';
