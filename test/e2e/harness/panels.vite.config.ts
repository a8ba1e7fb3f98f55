// Vite config of the panels harness page (test only, not shipped): serves panels.html on 127.0.0.1:5361.
// Run: npx vite --config test/e2e/harness/panels.vite.config.ts   then open http://127.0.0.1:5361/panels.html
import { harnessViteConfig } from './harnessViteConfig';

export default harnessViteConfig('panels', 5361);
