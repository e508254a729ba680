/** The "your analysis finished" e-mail to the person who started a job and asked for it. */
import { getEnv } from "~/env.server";
import { sendMail } from "~/mail/mailer.server";
import { findJobById } from "~/analyses/repository.server";
import type { DbExecutor } from "~/db/schema";
import { analysisPath } from "~/analyses/paths";

const KIND_WORDS = { analysis: "Analysis", scan: "Parameter scan", relation: "Relation test", timecourse: "Time course" } as const;

export async function notifyStarter(db: DbExecutor, id: string): Promise<void> {
  const job = await findJobById(db, id);
  if (!job || !job.starter_email) return;
  const lab = await db.selectFrom("labs").select("slug").where("id", "=", job.lab_id).executeTakeFirstOrThrow();
  const link = `${getEnv().appUrl}${analysisPath(lab.slug, job.parent_id ?? job.id)}`;
  const what = `${KIND_WORDS[job.kind]} of ${job.network_name} (version ${job.version_number})`;
  const outcome = job.status === "succeeded" ? "has finished" : job.status === "cancelled" ? "was cancelled" : "has failed";
  await sendMail({
    to: job.starter_email,
    subject: `Stillpoint: ${what} ${outcome}`,
    text: [`${what} ${outcome}.`, ...(job.error ? ["", `Reason: ${job.error}`] : []), "", `Open it: ${link}`, "", "You asked to be told when it ended."].join("\n"),
  });
}
