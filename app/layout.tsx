import "@fontsource/noto-sans/400.css";
import "@fontsource/noto-sans/600.css";
import "@fontsource/noto-sans/700.css";
import "./globals.css";
import type { Metadata, Viewport } from "next";
import { PendingSignOut } from "@/components/service-worker";

export const metadata: Metadata = {
  title: { default: "Hangarleaf", template: "%s · Hangarleaf" },
  description: "Manual library, task cards and sign-off for aviation maintenance technician schools",
  icons: { icon: "/icon.svg" },
};

export const viewport: Viewport = { themeColor: "#12243a" };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <body>
        {children}
        <PendingSignOut />
      </body>
    </html>
  );
}
