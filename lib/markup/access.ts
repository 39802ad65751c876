// Who may draw: the athlete's coach or an admin. Athletes and teammates see the markup read-only.
import type { SetReaderRole } from "@/lib/access";

export function canEditMarkup(role: SetReaderRole): boolean {
  return role === "coach" || role === "admin";
}
