import { withAuth } from "next-auth/middleware";

// Redirects only: signed-out visitors to workspace pages go to the sign-in
// page. Every real permission check happens next to the data (lib/auth/guard).
export default withAuth({ pages: { signIn: "/signin" } });

export const config = { matcher: ["/basins/:path*", "/admin/:path*"] };
