// Runs in the browser before any of the app's client code (Next's instrumentation-client
// convention). zod 4 tests once, when its first object schema is built, whether it may
// compile parsers with `new Function("")`; under the script policy (no 'unsafe-eval',
// README "Requests and headers") the test is blocked and reported as a CSP violation,
// although zod then parses without it. Saying up front that the browser is jitless skips
// the test (zod's own advice for strict policies). The server keeps the compiled parsers.
import { z } from "zod";

z.config({ jitless: true });
