import type { Me } from "@shared/schemas/auth";
import type { User } from "../entities/User";

export function presentMe(user: User): Me {
  return { id: user.id, email: user.email, displayName: user.displayName, emailVerified: !!user.emailVerifiedAt };
}
