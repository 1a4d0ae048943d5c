// Response shapes of the repricing API (see /api/reprice/* in the README).

export type Choice = 'keep' | 'suggested' | 'price';

export interface PriceChange {
  ingredientId: string;
  newPrice: string;
}

export interface Decision {
  drinkSizeId: string;
  choice: Choice;
  price?: string;
}

export interface ImpactRow {
  drinkId: string;
  drinkName: string;
  category: string;
  drinkSizeId: string;
  sizeId: string;
  size: string;
  priceVersion: number;
  via: ('direct' | 'preparation')[];
  through: string[];
  ingredients: string[];
  oldCost: string | null;
  newCost: string | null;
  costChange: string | null;
  costChangePct: string | null;
  currentPrice: string | null;
  oldMarginPct: string | null;
  newMarginPct: string | null;
  marginLostPct: string | null;
  targetMarginPct: string;
  wasBelowTarget: boolean;
  belowTarget: boolean;
  suggestedPrice: string | null;
  weeklyCups: string | null;
  cupsSource: 'sales' | 'expected' | null;
  weeklyCostIncrease: string | null;
  monthlyCostIncrease: string | null;
  decision: Choice;
  newPrice: string | null;
  newPriceMarginPct: string | null;
  newPriceBelowTarget: boolean;
  problem: string | null;
}

export interface ModifierImpactRow {
  modifierId: string;
  modifierName: string;
  kind: 'add' | 'swap';
  sizeId: string;
  size: string;
  ingredients: string[];
  oldCostDelta: string | null;
  newCostDelta: string | null;
  upcharge: string | null;
  oldMarginPct: string | null;
  newMarginPct: string | null;
  belowTarget: boolean;
  suggestedUpcharge: string | null;
}

export interface PriceToApply {
  drinkId: string;
  drinkName: string;
  drinkSizeId: string;
  size: string;
  oldPrice: string | null;
  price: string;
  priceVersion: number;
  ladderOnly: boolean;
}

export interface ImpactTotals {
  rows: number;
  drinks: number;
  wasBelowTarget: number;
  belowTarget: number;
  belowTargetAtNewPrices: number;
  pricesChanged: number;
  rowsWithCups: number;
  rowsWithoutCups: number;
  salesFrom: string;
  salesTo: string;
  weeklyCostIncrease: string;
  monthlyCostIncrease: string;
  weeklyProfitChange: string;
  monthlyProfitChange: string;
}

export interface Impact {
  currency: string;
  asOf: string;
  pricesAsOf: string;
  changes: {
    ingredientId: string;
    ingredientName: string;
    packId: string | null;
    packDescription: string | null;
    oldPrice: string | null;
    newPrice: string | null;
    changePct: string | null;
    source: 'typed' | 'planned';
  }[];
  rows: ImpactRow[];
  modifiers: ModifierImpactRow[];
  prices: PriceToApply[];
  totals: ImpactTotals;
}

export interface Scenario {
  id: string;
  name: string;
  notes: string | null;
  changes: PriceChange[];
  asOf: string | null;
  decisions: Decision[];
  keepLadder: boolean;
  status: 'draft' | 'applied';
  effectiveFrom: string | null;
  createdBy: string | null;
  createdAt: string;
  updatedAt: string;
  appliedBy: string | null;
  appliedAt: string | null;
}
