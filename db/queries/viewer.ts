// Who is asking: the signed-in person as every query sees them (access rules take a Viewer, never a raw id).
export interface Viewer {
  userId: string;
  name: string;
  email: string;
  role: "user" | "admin";
  emailVerified: boolean;
}

export function isAdmin(viewer: Viewer): boolean {
  return viewer.role === "admin";
}
