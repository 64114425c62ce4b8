import { z } from "zod";

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email("Enter a valid e-mail address")),
  password: z.string().min(1, "Enter your password"),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const userCreateSchema = z.object({
  name: z.string().trim().min(2, "Name must be at least 2 characters").max(120),
  email: z.string().trim().toLowerCase().pipe(z.email("Enter a valid e-mail address")),
  password: z.string().min(10, "Password must be at least 10 characters").max(200),
  isAdmin: z.boolean(),
});
export type UserCreateInput = z.infer<typeof userCreateSchema>;
