"use client";
import { FormField, SubmitButton } from "@/components/proof/form-field";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { signInSchema, type SignInInput } from "@/lib/validations/sign-in";

export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const result = await signIn("credentials", { ...values, redirect: false, callbackUrl });
    if (!result || result.error) {
      setFailure(result?.error && result.error !== "CredentialsSignin" ? result.error : "The e-mail address or password is not right.");
      return;
    }
    router.push(callbackUrl);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} className="mt-8 space-y-5" noValidate>
      {(
        [
          ["email", "E-mail", "email", "username"],
          ["password", "Password", "password", "current-password"],
        ] as const
      ).map(([name, label, type, autoComplete]) => (
        <FormField key={name} label={label} error={formState.errors[name]?.message}>
          <input
            type={type}
            autoComplete={autoComplete}
            {...register(name)}
            className="block w-full rounded border border-stone-300 bg-white px-3 py-2 font-mono text-sm"
          />
        </FormField>
      ))}
      {failure && (
        <p role="alert" data-testid="sign-in-failure" className="rounded border border-refuted/40 bg-red-50 px-3 py-2 text-sm text-refuted">
          {failure}
        </p>
      )}
      <SubmitButton
        busy={formState.isSubmitting}
        label="Sign in"
        busyLabel="Signing in…"
        className="w-full rounded bg-lichen-600 px-4 py-2 font-semibold text-white hover:bg-lichen-700 disabled:opacity-60"
      />
    </form>
  );
}
