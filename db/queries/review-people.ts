// Who to write to about a review: the athlete's name and address.
import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { user } from "@/db/schema";

export async function findUserContact(userId: string): Promise<{ name: string; email: string } | null> {
  const [row] = await db.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, userId));
  return row ?? null;
}
