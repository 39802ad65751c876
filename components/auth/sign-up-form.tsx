"use client";
// Sign-up form: name, e-mail and password through better-auth; the person is signed in straight away.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { signUp } from "@/lib/auth-client";
import { PASSWORD_MIN_LENGTH, signUpSchema, type SignUpInput } from "@/lib/validation/auth";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormError, TextField } from "@/components/ui/field";
import { authErrorMessage } from "./auth-messages";

export function SignUpForm({ next, email }: { next: string; email?: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const form = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: "", email: email ?? "", password: "" },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(undefined);
    // The confirmation link in the welcome mail brings the person back to the same place.
    const { error } = await signUp.email({ ...values, callbackURL: next });
    if (error) {
      setFormError(authErrorMessage(error));
      return;
    }
    router.replace(next);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <FormError message={formError} />
      <TextField label="Name" autoComplete="name" error={errors.name?.message} {...form.register("name")} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        defaultValue={email}
        error={errors.email?.message}
        {...form.register("email")}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.password?.message}
        {...form.register("password")}
      />
      <SubmitButton size="lg" block pending={isSubmitting}>
        Create account
      </SubmitButton>
    </form>
  );
}
