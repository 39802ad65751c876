"use client";
// Signs out through better-auth and returns to the sign-in page.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { signOut } from "@/lib/auth-client";
import { Button, type ButtonSize } from "@/components/ui/button";

export function SignOutButton({ size = "sm" }: { size?: ButtonSize }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  async function handleClick() {
    setPending(true);
    await signOut();
    router.replace("/sign-in");
    router.refresh();
  }
  return (
    <Button variant="quiet" size={size} pending={pending} onClick={handleClick}>
      Sign out
    </Button>
  );
}
