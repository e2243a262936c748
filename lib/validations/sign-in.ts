import { z } from "./zod";

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email("Enter an e-mail address such as name@example.org."),
  password: z.string().min(1, "Enter your password.").max(200),
});

export type SignInInput = z.infer<typeof signInSchema>;
