// Which pages the navigation offers, from the person's roles on their teams.
import type { MembershipRole } from "@/lib/validation/common";
import type { NavItem } from "./nav-links";

export function navItemsFor(roles: ReadonlySet<MembershipRole>): NavItem[] {
  const items: NavItem[] = [];
  if (roles.has("coach")) items.push({ href: "/app/desk", label: "Review desk" }, { href: "/app/roster", label: "Roster" });
  if (roles.has("athlete")) items.push({ href: "/app/home", label: "Home" });
  if (roles.size > 0) items.push({ href: "/app/sets", label: "Sets" }, { href: "/app/compare", label: "Compare" }, { href: "/app/trends", label: "Trends" });
  if (roles.size > 0) items.push({ href: "/app/billing", label: "Billing" });
  if (roles.size === 0) items.push({ href: "/app/team/new", label: "New team" });
  items.push({ href: "/app/settings/profile", label: "Profile" });
  return items;
}
