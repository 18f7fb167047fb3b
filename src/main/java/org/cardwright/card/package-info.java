/**
 * Diode {@code .model} cards as text: SPICE number writing and reading ({@link org.cardwright.card.SpiceNumbers}),
 * simulator dialects ({@link org.cardwright.card.Dialect}), the card value
 * ({@link org.cardwright.card.ModelCard}), writing through the FreeMarker templates of the top-level
 * {@code templates/} folder ({@link org.cardwright.card.CardWriter}) and reading cards back
 * ({@link org.cardwright.card.CardReader}). FreeMarker is used in this package only.
 */
package org.cardwright.card;
