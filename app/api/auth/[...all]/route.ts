// better-auth's endpoints (sign-in, sign-up, verification, password reset, admin) under /api/auth/*.
import { toNextJsHandler } from "better-auth/next-js";
import { auth } from "@/lib/auth";

export const { GET, POST } = toNextJsHandler(auth);
