import { Op, type Transaction } from 'sequelize';
import type { Deps } from '../deps';
import { CURRENCY, formatMoney, planLabel, planPrices, priceOfRun, runPriceCeiling, runSizeRefusal, type RunPrice, type RunSize } from '../../shared/plans';
import type { RunQuote } from '../../shared/schemas/billing';
import { balanceOf } from './ledger';

export type PricingDeps = Pick<Deps, 'db' | 'models'>;

function monthStart(now = new Date()): Date {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1));
}

/** Runs the organisation created this calendar month (UTC), for the monthly allowance. */
export async function runsThisMonth(deps: PricingDeps, organisationId: number, transaction?: Transaction): Promise<number> {
  return deps.models.Run.count({ where: { organisationId, createdAt: { [Op.gte]: monthStart() } }, transaction });
}

/**
 * The price of a run of this size for this organisation (priceOfRun with its plan and month so
 * far) and whether its credits cover it — or, for a size beyond the plan's paid ceiling, a refusal
 * and no price. The run planning (services/runs/planning.ts) calls this for create and preview;
 * nothing is written.
 */
export async function quoteRun(deps: PricingDeps, organisationId: number, size: Omit<RunSize, 'runsThisMonth'>): Promise<RunQuote> {
  const org = await deps.models.Organisation.findByPk(organisationId, { attributes: ['id', 'plan'] });
  const plan = org?.plan ?? 'free';
  const used = await runsThisMonth(deps, organisationId);
  const refusal = runSizeRefusal(plan, size);
  const price: RunPrice | null = refusal ? null : priceOfRun(plan, { ...size, runsThisMonth: used });
  const balance = await balanceOf(deps, organisationId);
  const prices = planPrices(plan);
  const note = refusal
    ? `${refusal.message} No price: this run cannot start as it is.`
    : price
    ? balance >= price.amount
      ? `This run costs ${formatMoney(price)}; the organisation's credits (${formatMoney({ amount: balance, currency: CURRENCY })}) cover it once an admin confirms, or pay it by card.`
      : `This run costs ${formatMoney(price)}; the credits (${formatMoney({ amount: balance, currency: CURRENCY })}) do not cover it — pay it by card, or ask an admin to buy credits.`
    : `Free: inside the ${planLabel(plan)} plan's included size (${used} of ${prices.monthlyFreeRuns} runs used this month).`;
  return {
    plan: { id: plan, label: planLabel(plan) },
    price,
    balance: { amount: balance, currency: CURRENCY },
    affordable: price !== null && balance >= price.amount,
    runsThisMonth: used,
    monthlyFreeRuns: prices.monthlyFreeRuns,
    note,
    refusal: refusal?.message ?? null,
    ceiling: { amount: runPriceCeiling(plan), currency: CURRENCY },
  };
}
