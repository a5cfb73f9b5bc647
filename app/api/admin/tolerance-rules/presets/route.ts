import { withAccess } from "@/server/http/with-access";
import { restoreTolerancePresets } from "@/server/tolerance/queries";

/** Adds back the presets whose names the company no longer has; it never changes a rule. */
export const POST = withAccess({ permission: "company:manage" }, async ({ access }) => restoreTolerancePresets(access));
