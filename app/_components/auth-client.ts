"use client";

import { createAuthClient } from "better-auth/react";

// Same origin as the page: the auth routes live at /api/auth.
export const authClient = createAuthClient();
