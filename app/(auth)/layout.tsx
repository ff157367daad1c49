import type { ReactNode } from "react";
import { BrandMark } from "../_components/brand";

export default function SignedOutLayout({ children }: { children: ReactNode }) {
  return (
    <div className="min-h-screen bg-basalt-900 bg-[radial-gradient(circle_at_20%_0%,#2e3d46_0,#172026_60%)]">
      <div className="mx-auto grid min-h-screen max-w-5xl grid-cols-1 items-center gap-10 px-6 py-12 md:grid-cols-[1fr_420px]">
        <section className="text-grout-100">
          <div className="flex items-center gap-3 text-ochre-300">
            <BrandMark className="h-10 w-10" />
            <span className="text-2xl font-semibold tracking-tight text-white">Plinthwise</span>
          </div>
          <p className="mt-6 max-w-md text-lg text-grout-200">
            The shared desk where machine foundations are designed, checked and signed off: vendor data in, published
            methods through, every issued number traceable.
          </p>
        </section>
        <section className="slab p-6">{children}</section>
      </div>
    </div>
  );
}
