// Vite config of the map harness page (test only, not shipped): serves map.html on 127.0.0.1:5347.
// Run: npx vite --config test/e2e/harness/map.vite.config.ts   then open http://127.0.0.1:5347/map.html
import { harnessViteConfig } from './harnessViteConfig';

export default harnessViteConfig('map', 5347);
