import { describe, expect, it } from 'vitest';
import { createCarrierState } from '../../../estimator/sim/world/carrierPath.js';
import { createDeckContact, deckContact } from '../../../estimator/sim/world/deckContact.js';
import { createLanderState } from '../../../estimator/sim/world/landerDynamics.js';
import { pitchQuaternionInPlace } from '../../../estimator/sim/world/thrustAttitude.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('deckContact', () => {
  it('deckContact() on a level deck gives height, closing and lateral speed by subtraction (hand-derived)', () => {
    const carrier = createCarrierState();
    carrier.position.set([10, 5, 1.2]);
    carrier.velocity.set([3, 0, 0]);
    const lander = createLanderState();
    lander.position.set([10.4, 4.9, 1.5]);
    lander.velocity.set([2.5, 0.5, -0.8]);
    const contact = deckContact(lander, carrier, 3, 2, createDeckContact(), 0.1);
    expectClose(contact.height, 0.2, { abs: 1e-12 }, 'height = 1.5 - 1.2 - 0.1'); // rounding only
    expect(contact.inContact).toBe(false);
    expectClose(contact.closingSpeed, 0.8, { abs: 1e-12 }, 'closing');
    expectClose(contact.lateralSpeed, Math.hypot(0.5, 0.5), { abs: 1e-12 }, 'lateral');
    expectClose(contact.along, 0.4, { abs: 1e-12 }, 'along');
    expectClose(contact.across, -0.1, { abs: 1e-12 }, 'across');
    expect(contact.onDeck).toBe(true);
    expectClose(contact.tilt, 0, { abs: 1e-7 }, 'level lander on level deck'); // acos near 1 loses half the digits
  });

  it('deckContact() on a deck pitched by theta measures along its normal', () => {
    const theta = 0.1;
    const carrier = createCarrierState();
    pitchQuaternionInPlace(carrier.qWorldDeck, theta); // heading 0: nose-down pitch about the left axis
    const lander = createLanderState();
    lander.position.set([0, 0, 2]);
    const contact = deckContact(lander, carrier, 3, 2, createDeckContact());
    // deck normal n = (sin theta, 0, cos theta): height = 2 cos theta; along = d . e_x = -2 sin theta
    expectClose(contact.height, 2 * Math.cos(theta), { abs: 1e-12 }, 'height');
    expectClose(contact.along, -2 * Math.sin(theta), { abs: 1e-12 }, 'along');
    expectClose(contact.tilt, theta, { abs: 1e-12 }, 'relative tilt of a level lander');
    lander.position.set([0, 0, -0.01]);
    expect(deckContact(lander, carrier, 3, 2, createDeckContact()).inContact).toBe(true);
    lander.position.set([5, 0, 0.5]);
    expect(deckContact(lander, carrier, 3, 2, createDeckContact()).onDeck).toBe(false);
  });
});
