package org.cardwright.data;

/** What a measurement file holds, told apart by its header: an I column or a C column beside V. */
public enum DataKind {
    /** Current against voltage: columns V and I. */
    IV,
    /** Capacitance against voltage: columns V and C. */
    CV
}
