// The child process of a bulk audit (src/certify/bulk.ts): audits one certificate folder per
// message and sends the report back, so several audits run on several cores at once.
import { isPlumblineError } from "../util/errors.js";
import { auditCertificate } from "./audit.js";
import type { ChildReply, ChildRequest } from "./bulk.js";

const send = (m: ChildReply) => process.send!(m);

process.on("message", (m: ChildRequest) => {
  const deadline = m.timeLimit === null ? undefined : Date.now() + m.timeLimit * 1000;
  try {
    send({ id: m.id, report: auditCertificate(m.dir, { deadline }), error: null, internal: false });
  } catch (e) {
    send({ id: m.id, report: null, error: (e as Error)?.message ?? String(e), internal: !isPlumblineError(e) });
  }
});
// the parent going away ends the child
process.on("disconnect", () => process.exit(0));
