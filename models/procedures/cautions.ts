// The safety notes the demo procedures show before the first stage, in our own words.
export const CAUTIONS = {
  plugLead:
    'Pull the spark plug lead off and ground it before you start: a turned crankshaft can fire the plug.',
  coolEngine: 'Work only on a cool engine. The head, cylinder and muffler stay hot long after it stops.',
  fuel: 'Drain the tank or shut off the fuel before you tip or open the engine, and wipe up any spill at once.',
  eyes: 'Wear eye protection: pins, springs and solvent can fly or splash.',
  solventsAndOil:
    'Keep solvents, oil and oily rags away from sparks and flames, and dispose of them under local rules.',
  serviceData:
    'Torque values here are demo values for a fictional engine. Real work follows the engine maker\'s service data and local shop practice; this trainer does not replace the service manual or a qualified instructor.',
} as const;
