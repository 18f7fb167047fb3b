/**
 * How numbers are written in SPICE: the one table of scale suffixes. Like {@code failure}, this package sits
 * outside the layer order: every package may use it, and it uses none.
 */
package org.cardwright.notation;
