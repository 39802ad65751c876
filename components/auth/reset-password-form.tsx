"use client";
// Sets a new password with the token from the reset link.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { resetPassword } from "@/lib/auth-client";
import { PASSWORD_MIN_LENGTH, resetPasswordSchema, type ResetPasswordInput } from "@/lib/validation/auth";
import { Banner } from "@/components/ui/banner";
import { ButtonLink } from "@/components/ui/button";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormError, TextField } from "@/components/ui/field";
import { authErrorMessage } from "./auth-messages";

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [formError, setFormError] = useState<string>();
  const form = useForm<ResetPasswordInput>({
    resolver: zodResolver(resetPasswordSchema),
    defaultValues: { password: "", confirmPassword: "" },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async ({ password }) => {
    setFormError(undefined);
    const { error } = await resetPassword({ newPassword: password, token });
    if (error) {
      setFormError(authErrorMessage(error));
      return;
    }
    setDone(true);
  });

  if (done) {
    return (
      <div className="grid gap-4">
        <Banner live title="Password changed">
          Sign in with the new password. Other devices were signed out.
        </Banner>
        <ButtonLink href="/sign-in" size="lg" block>
          Sign in
        </ButtonLink>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <FormError message={formError} />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.password?.message}
        {...form.register("password")}
      />
      <TextField
        label="New password again"
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...form.register("confirmPassword")}
      />
      <SubmitButton size="lg" block pending={isSubmitting}>
        Set the new password
      </SubmitButton>
    </form>
  );
}
