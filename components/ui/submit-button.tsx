"use client";
// A form's submit button that stays disabled until the page is interactive, so an early click cannot fall
// back to a plain HTML submit (which would put the form's fields, passwords included, in the address bar).
import { useSyncExternalStore, type ComponentProps } from "react";
import { Button } from "./button";

const subscribe = () => () => {};

export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}

export function SubmitButton({ disabled, ...props }: Omit<ComponentProps<typeof Button>, "type">) {
  const hydrated = useHydrated();
  return <Button type="submit" disabled={disabled || !hydrated} {...props} />;
}
