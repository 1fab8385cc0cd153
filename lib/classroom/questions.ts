import "server-only";
import { Op } from "sequelize";
import { SESSION_ENDED, touchSession } from "@/lib/data/class-sessions";
import { notifySession } from "@/lib/classroom/notify-hub";
import { db } from "@/lib/db";
import { UserFacingError } from "@/lib/errors";
import type { ClassAnswer, ClassParticipant, ClassQuestion, User } from "@/models";

/**
 * Quick questions in a class session: the host asks (one question open at a time), participants
 * answer and may change their answer while it is open, and the host sees the tally with each
 * participant's answer. Every change is written, counted on the session, then announced.
 */

export interface QuestionSummary {
  id: string;
  prompt: string;
  choices: string[];
  open: boolean;
  createdAt: string;
}

export interface TallyQuestion {
  id: string;
  prompt: string;
  choices: string[];
  open: boolean;
  /** Answers per choice, in the order of the choices. */
  counts: number[];
  answers: { participant: string; choice: number }[];
}

export interface Tally {
  questions: TallyQuestion[];
}

function toSummary(q: ClassQuestion): QuestionSummary {
  return { id: q.id, prompt: q.prompt, choices: q.choices, open: q.open, createdAt: q.createdAt.toISOString() };
}

async function refuseIfEnded(sessionId: string): Promise<void> {
  const session = await db().models.ClassSession.findByPk(sessionId, { attributes: ["status"] });
  if (!session || session.status === "ended") throw new UserFacingError(SESSION_ENDED);
}

/** Ask a question; any question still open is closed first. */
export async function askQuestion(sessionId: string, input: { prompt: string; choices: string[] }): Promise<QuestionSummary> {
  const { sequelize, models } = db();
  await refuseIfEnded(sessionId);
  const question = await sequelize.transaction(async (transaction) => {
    await models.ClassQuestion.update({ open: false }, { where: { sessionId, open: true }, transaction });
    const created = await models.ClassQuestion.create({ sessionId, prompt: input.prompt, choices: input.choices }, { transaction });
    await models.ClassSession.increment("questionsVersion", { where: { id: sessionId }, transaction });
    return created;
  });
  await touchSession(sessionId);
  await notifySession(sessionId);
  return toSummary(question);
}

/** Close a question: no more answers or changes. Null when it is not this session's. */
export async function closeQuestion(sessionId: string, questionId: string): Promise<QuestionSummary | null> {
  const { sequelize, models } = db();
  const question = await sequelize.transaction(async (transaction) => {
    const row = await models.ClassQuestion.findOne({ where: { id: questionId, sessionId }, transaction, lock: true });
    if (!row) return null;
    if (row.open) {
      await row.update({ open: false }, { transaction });
      await models.ClassSession.increment("questionsVersion", { where: { id: sessionId }, transaction });
    }
    return row;
  });
  if (!question) return null;
  await touchSession(sessionId);
  await notifySession(sessionId);
  return toSummary(question);
}

/** Record (or change) a participant's answer to an open question of this session. */
export async function answerQuestion(
  sessionId: string,
  participantId: string,
  input: { questionId: string; choice: number },
): Promise<void> {
  const { sequelize, models } = db();
  await refuseIfEnded(sessionId);
  await sequelize.transaction(async (transaction) => {
    const question = await models.ClassQuestion.findOne({ where: { id: input.questionId, sessionId }, transaction });
    if (!question) throw new UserFacingError("That question is not part of this session.", "questionId");
    if (!question.open) throw new UserFacingError("That question is closed.", "questionId");
    if (input.choice >= question.choices.length) throw new UserFacingError("Choose one of the answers.", "choice");
    const existing = await models.ClassAnswer.findOne({ where: { questionId: question.id, participantId }, transaction, lock: true });
    if (existing) {
      if (existing.choice === input.choice) return;
      await existing.update({ choice: input.choice }, { transaction });
    } else {
      await models.ClassAnswer.create({ questionId: question.id, participantId, choice: input.choice }, { transaction });
    }
    await models.ClassSession.increment("answersVersion", { where: { id: sessionId }, transaction });
  });
  await notifySession(sessionId);
}

/** Each participant's answer to one question (index into its choices), for the participants asked about. */
export async function answersOf(questionId: string, participantIds: string[]): Promise<Map<string, number>> {
  if (participantIds.length === 0) return new Map();
  const rows = await db().models.ClassAnswer.findAll({
    where: { questionId, participantId: { [Op.in]: participantIds } },
    attributes: ["participantId", "choice"],
  });
  return new Map(rows.map((r) => [r.participantId, r.choice]));
}

/** Every question of the session, oldest first, with its counts and who answered what. */
export async function getTally(sessionId: string): Promise<Tally> {
  const { models } = db();
  const questions = await models.ClassQuestion.findAll({
    where: { sessionId },
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
    include: [
      {
        model: models.ClassAnswer,
        as: "answers",
        include: [
          {
            model: models.ClassParticipant,
            as: "participant",
            include: [{ model: models.User, as: "user", attributes: ["name"] }],
          },
        ],
      },
    ],
  });
  return {
    questions: questions.map((q) => {
      const answers = ((q as ClassQuestion & { answers?: ClassAnswer[] }).answers ?? [])
        .map((a) => {
          const participant = (a as ClassAnswer & { participant?: ClassParticipant & { user?: User | null } }).participant;
          const name = participant?.user?.name ?? (participant?.guestName ? `${participant.guestName} (guest)` : "Someone");
          return { participant: name, choice: a.choice };
        })
        .sort((a, b) => a.participant.localeCompare(b.participant, "en"));
      const counts = q.choices.map((_, i) => answers.filter((a) => a.choice === i).length);
      return { id: q.id, prompt: q.prompt, choices: q.choices, open: q.open, counts, answers };
    }),
  };
}
