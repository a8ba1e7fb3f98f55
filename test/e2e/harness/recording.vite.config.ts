// Vite config of the recording/correlations harness page (test only, not shipped): serves recording.html on 127.0.0.1:5317.
// Run: npx vite --config test/e2e/harness/recording.vite.config.ts   then open http://127.0.0.1:5317/recording.html
import { harnessViteConfig } from './harnessViteConfig';

export default harnessViteConfig('recording', 5317);
