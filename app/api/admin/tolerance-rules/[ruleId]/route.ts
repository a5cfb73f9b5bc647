import { withAccess } from "@/server/http/with-access";
import { ToleranceRulePatch } from "@/server/tolerance/contract";
import { deleteToleranceRule, updateToleranceRule } from "@/server/tolerance/queries";
import { ToleranceRuleParams } from "@/server/http/params";

// The queries look the rule up within the administrator's company: another company's id is a 404.

export const PATCH = withAccess(
  { permission: "company:manage", body: ToleranceRulePatch, params: ToleranceRuleParams },
  ({ access, params, body }) => updateToleranceRule(access, params.ruleId, body),
);

/** Refused with 409 while routines have chosen the rule by hand. */
export const DELETE = withAccess({ permission: "company:manage", params: ToleranceRuleParams }, ({ access, params }) =>
  deleteToleranceRule(access, params.ruleId),
);
