"use client";
// Asks for a password-reset link. The answer is the same whether or not the address has an account.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { requestPasswordReset } from "@/lib/auth-client";
import { forgotPasswordSchema, type ForgotPasswordInput } from "@/lib/validation/auth";
import { Banner } from "@/components/ui/banner";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormError, TextField } from "@/components/ui/field";
import { authErrorMessage } from "./auth-messages";

export function ForgotPasswordForm() {
  const [sentTo, setSentTo] = useState<string>();
  const [formError, setFormError] = useState<string>();
  const form = useForm<ForgotPasswordInput>({ resolver: zodResolver(forgotPasswordSchema), defaultValues: { email: "" } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async ({ email }) => {
    setFormError(undefined);
    const { error } = await requestPasswordReset({ email, redirectTo: "/reset-password" });
    if (error) {
      setFormError(authErrorMessage(error));
      return;
    }
    setSentTo(email);
  });

  if (sentTo) {
    return (
      <Banner live title="Check your inbox">
        If an account exists for {sentTo}, a link to choose a new password is on its way. It works once and expires
        within the hour.
      </Banner>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <FormError message={formError} />
      <TextField label="E-mail" type="email" autoComplete="email" error={errors.email?.message} {...form.register("email")} />
      <SubmitButton size="lg" block pending={isSubmitting}>
        Send the link
      </SubmitButton>
    </form>
  );
}
