import express, { Router } from 'express';
import type Stripe from 'stripe';
import type { AppDeps } from '../platform/deps';
import { badRequest } from '../platform/errors';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { payOrderSchema } from '../../src/shared/ordering';
import { presentOrder } from '../orders/orders.service';
import { presentCard, removeCard, saveCard } from './cards.service';
import { checkPayment, handleWebhookEvent, payOrder } from './payments.service';
import { paymentsClient } from './stripe-client';

export function paymentsRoutes(deps: AppDeps) {
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/payments/card', allow('payments.manage'), async (req, res) => {
    res.json(await presentCard(deps, req.user!.businessId));
  });

  r.put('/api/payments/card', allow('payments.manage'), async (req, res) => {
    const { paymentMethodId } = parse(payOrderSchema, req.body);
    res.json(await saveCard(deps, req.user!, paymentMethodId));
  });

  r.delete('/api/payments/card', allow('payments.manage'), async (req, res) => {
    res.json(await removeCard(deps, req.user!.businessId));
  });

  r.post('/api/purchase-orders/:id/pay', allow('orders.pay'), async (req, res) => {
    const { paymentMethodId } = parse(payOrderSchema, req.body);
    const id = String(req.params.id);
    await payOrder(deps, req.user!, id, paymentMethodId);
    res.json(await presentOrder(deps, req.user!.businessId, id));
  });

  r.post('/api/purchase-orders/:id/payment/check', allow('orders.pay'), async (req, res) => {
    const id = String(req.params.id);
    await checkPayment(deps, req.user!, id);
    res.json(await presentOrder(deps, req.user!.businessId, id));
  });

  return r;
}

/**
 * The provider's webhook: the signature is checked on the raw bytes (so this router is
 * mounted before the JSON parser), and each event id is applied once.
 */
export function paymentsWebhookRoutes(deps: AppDeps) {
  const r = Router();
  r.post('/api/webhooks/payments', express.raw({ type: 'application/json', limit: '512kb' }), async (req, res) => {
    const signature = req.get('stripe-signature');
    if (!signature || !Buffer.isBuffer(req.body)) throw badRequest('bad_signature', 'The webhook has no valid signature.');
    let event: Stripe.Event;
    try {
      event = paymentsClient(deps.config).webhooks.constructEvent(req.body, signature, deps.config.STRIPE_WEBHOOK_SECRET);
    } catch {
      throw badRequest('bad_signature', 'The webhook signature does not match, or it is too old.');
    }
    const outcome = await handleWebhookEvent(deps, event);
    res.json({ received: true, outcome });
  });
  return r;
}
