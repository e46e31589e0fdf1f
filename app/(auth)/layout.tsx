import { Caution, Main } from "@/components/ui";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <Main className="flex min-h-screen flex-col items-center justify-center gap-6 p-6">
      <div className="text-center">
        <p className="text-2xl font-semibold tracking-tight">Linkwright</p>
        <p className="text-ink-soft">Control runs, joint hardware and their review — for people who build their own aircraft.</p>
      </div>
      <div className="w-full max-w-sm rounded-lg border border-ink/10 bg-white p-6 shadow-sm">{children}</div>
      <Caution className="max-w-md" />
    </Main>
  );
}
