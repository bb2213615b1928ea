import type { Metadata } from "next";
import type { ReactNode } from "react";
import { headers } from "next/headers";
import "./globals.css";
import { QueryProvider } from "@/components/providers/query-provider";
import { currentUser } from "@/lib/session";

export const metadata: Metadata = {
  title: { default: "Rimeplan", template: "%s · Rimeplan" },
  description: "Refrigeration planning for cold-chain warehouses",
};

// Applies the saved theme before paint; "system" follows the OS setting.
const themeScript = `(function(){try{var t=document.documentElement.dataset.theme;var d=t==='dark'||(t==='system'&&matchMedia('(prefers-color-scheme: dark)').matches);document.documentElement.classList.toggle('dark',d);}catch(e){}})();`;

export default async function RootLayout({ children }: { children: ReactNode }) {
  const user = await currentUser().catch(() => null);
  const theme = user?.theme ?? "system";
  // proxy.ts puts a fresh nonce in the page's Content-Security-Policy; our one inline script carries it.
  const nonce = (await headers()).get("x-nonce") ?? undefined;
  return (
    <html lang="en" data-theme={theme} className={theme === "dark" ? "dark" : ""} suppressHydrationWarning>
      <head>
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: themeScript }} />
      </head>
      <body className="min-h-screen antialiased">
        <QueryProvider>{children}</QueryProvider>
      </body>
    </html>
  );
}
