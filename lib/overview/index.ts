/** What the Overview page shows each role: own batches, newly accepted entries, work to review. */
import { Op } from "sequelize";
import { RegistryEntry } from "@/models";
import { listBatches } from "@/lib/batches";
import { hasRole } from "@/lib/auth/roles";
import type { CurrentUser } from "@/lib/auth/current-user";
import { registryRow, visibleEntriesWhere } from "@/lib/registry";

export async function overviewFor(user: CurrentUser) {
  const visible = visibleEntriesWhere(user);
  const [accepted, totals] = await Promise.all([
    RegistryEntry.findAll({ where: { [Op.and]: [visible, { curationState: "accepted" }] }, order: [["updatedAt", "DESC"]], limit: 8 }),
    Promise.all([
      RegistryEntry.count({ where: visible }),
      RegistryEntry.count({ where: { [Op.and]: [visible, { reducibility: "reducible" }] } }),
      RegistryEntry.count({ where: { [Op.and]: [visible, { published: true }] } }),
    ]),
  ]);
  const researcher = hasRole(user.role, "researcher");
  const curator = hasRole(user.role, "curator");
  // "My" batches even for curators and admins, who otherwise see everyone's.
  const mine = researcher ? await listBatches({ ...user, role: "researcher" }, 6) : null;
  const review = curator
    ? await Promise.all([
        RegistryEntry.count({ where: { agreement: "conflict", curationState: { [Op.in]: ["candidate", "returned"] } } }),
        RegistryEntry.count({ where: { curationState: "candidate", variantsScreened: { [Op.gt]: 0 } } }),
      ])
    : null;
  return {
    totals: { entries: totals[0], reducible: totals[1], published: totals[2] },
    accepted: accepted.map(registryRow),
    myBatches: mine,
    review: review ? { conflicts: review[0], candidates: review[1] } : null,
  };
}
