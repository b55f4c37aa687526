import { buildSite } from "/work/main/lib/publish/build.ts";
const t=Date.now();await buildSite({ root: "/tmp/rssprobe-ErgfDw", pdf: false });
const t2=Date.now();await buildSite({ root: "/tmp/rssprobe-ErgfDw", pdf: false });
process.stdout.write(JSON.stringify({cold:t2-t, warm: Date.now()-t2, rssMiB: process.resourceUsage().maxRSS/1024}));
