/** Probes of the mail settings routes (see ../role-matrix.test.ts). */
import { rule, type Probe } from "./expect";
import { hit } from "./world";

const L = {
  shopMail: () => import("@/app/api/settings/mail/route"),
  myMail: () => import("@/app/api/settings/my-mail/route"),
};

export const MAIL_PROBES: Probe[] = [
  { route: "GET /api/settings/mail", call: (as) => hit(L.shopMail, "GET", "/x", as), expect: rule("members.manage"), outsider: "no-leak" },
  {
    route: "PUT /api/settings/mail",
    call: (as) => hit(L.shopMail, "PUT", "/x", as, { body: { senderName: "Matrix Heating", reviewMailTo: "leads" } }),
    expect: rule("members.manage"),
    outsider: "no-leak",
  },
  { route: "GET /api/settings/my-mail", call: (as) => hit(L.myMail, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "PUT /api/settings/my-mail", call: (as) => hit(L.myMail, "PUT", "/x", as, { body: { off: [] } }), expect: rule("member"), outsider: "no-leak" },
];
