import { withAccess } from "@/server/http/with-access";
import { CompanySettingsInput } from "@/server/deferrals/contract";
import { loadCompanySettings, updateCompanySettings } from "@/server/deferrals/settings";

/** The company's settings: who decides deferrals of plain work. */
export const GET = withAccess({ permission: "company:manage" }, ({ access }) => loadCompanySettings(access));

export const PATCH = withAccess({ permission: "company:manage", body: CompanySettingsInput }, ({ access, body }) =>
  updateCompanySettings(access, body),
);
