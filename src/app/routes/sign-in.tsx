import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Navigate, useNavigate, useSearchParams } from "react-router";
import { SignInSchema, type SignIn } from "@shared/schemas/auth.ts";
import { useMe, useSignIn } from "@/features/session/api/session.ts";
import { TextField } from "@/components/ui/field.tsx";
import { Button } from "@/components/ui/button.tsx";
import { ErrorNotice } from "@/components/ui/feedback.tsx";
import { LogoMark } from "@/components/ui/logo.tsx";
import { ApiError } from "@/lib/api-client.ts";

/** Only paths inside the app are followed after sign-in. */
function safeNext(next: string | null): string {
  return next?.startsWith("/") && !next.startsWith("//") ? next : "/";
}

export function Component() {
  const [params] = useSearchParams();
  const next = safeNext(params.get("next"));
  const navigate = useNavigate();
  const me = useMe();
  const signIn = useSignIn();
  const form = useForm<SignIn>({ resolver: zodResolver(SignInSchema), defaultValues: { email: "", password: "" } });
  const errors = form.formState.errors;

  if (me.data) return <Navigate to={next} replace />;

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: () => navigate(next, { replace: true }),
      onError: () => form.setFocus("password"),
    }),
  );
  const error = signIn.error;

  return (
    <main className="flex min-h-screen items-center justify-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-8 text-center">
          <div className="inline-block">
            <LogoMark size={44} />
          </div>
          <h1 className="mt-3 text-2xl font-bold tracking-tight">Sign in to Reversa</h1>
          <p className="mt-1 text-sm text-graphite">Mount plans, mounting history and condition records for works on paper.</p>
        </div>
        <form onSubmit={onSubmit} noValidate className="space-y-4 rounded-card bg-paper-sheet p-6 shadow-card">
          {error && <ErrorNotice title={error instanceof ApiError && error.status === 429 ? "Too many attempts" : "Not signed in"} error={error} />}
          <TextField label="E-mail address" type="email" autoComplete="username" autoFocus error={errors.email?.message} {...form.register("email")} />
          <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...form.register("password")} />
          <Button type="submit" className="w-full" disabled={signIn.isPending}>
            {signIn.isPending ? "Signing in…" : "Sign in"}
          </Button>
        </form>
        <p className="mt-6 text-center text-xs text-graphite">Accounts are created by your studio's admin.</p>
      </div>
    </main>
  );
}
