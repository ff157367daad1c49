// For scripts/test.sh: writes nginx's runtime config in front of the test servers and prints
// its path (the shell starts /usr/sbin/nginx with it and stops it by pid at the end).
// Usage: tsx scripts/lib/balancer-config.mts PORT 127.0.0.1:A 127.0.0.1:B
// The answers carry X-Plinthwise-Upstream (the server that answered) for the balancer test.
import { writeBalancerConfig } from "./nginx.mts";

const [port, ...upstreams] = process.argv.slice(2);
if (!port || !/^\d+$/.test(port) || upstreams.length === 0 || !upstreams.every((u) => /^[\d.]+:\d+$/.test(u))) {
  console.error("usage: balancer-config.mts PORT HOST:PORT...");
  process.exit(2);
}
const written = writeBalancerConfig("/usr/sbin/nginx", process.cwd(), Number(port), upstreams, { upstreamHeader: true });
if (typeof written === "string") {
  console.error(written);
  process.exit(1);
}
console.log(written.configFile);
