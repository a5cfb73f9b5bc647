import { withAccess } from "@/server/http/with-access";
import { ToleranceRuleInput } from "@/server/tolerance/contract";
import { createToleranceRule, listToleranceRules } from "@/server/tolerance/queries";

/** The company's tolerance rules, by kind, then in the company's order, then by interval size. */
export const GET = withAccess({ permission: "company:manage" }, async ({ access }) => ({
  rules: await listToleranceRules(access),
}));

export const POST = withAccess({ permission: "company:manage", body: ToleranceRuleInput }, async ({ access, body }) =>
  Response.json(await createToleranceRule(access, body), { status: 201 }),
);
