import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { DesignForm } from "@/components/design/design-form";
import { solvableCoefficients } from "@/lib/screening/design";

export const metadata = { title: "Design" };

export default async function DesignPage() {
  const access = await pageAccess("researcher");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  const solvable = { nls: solvableCoefficients("nls"), kdv: solvableCoefficients("kdv"), mkdv: solvableCoefficients("mkdv") };
  return (
    <>
      <PageHeader
        title="Design a model"
        lead="Fix every coefficient but one and pick the unknown: Wavesieve solves for the coefficient that makes the equation reducible to its canonical form, with its integration constants, and screens the designed model before showing it. Closed forms can be submitted as a family; coefficients that exist only as a table cannot."
      />
      <DesignForm solvable={solvable} />
    </>
  );
}
