import { Brand } from "@/components/brand";
import { SafetyNotice } from "@/components/safety-notice";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="bg-deck px-6 py-4">
        <Brand inverted />
      </header>
      <main id="main" className="mx-auto flex w-full max-w-md flex-1 flex-col gap-6 px-4 py-10">
        {children}
      </main>
      <footer className="mx-auto w-full max-w-md px-4 pb-8">
        <SafetyNotice compact />
      </footer>
    </div>
  );
}
