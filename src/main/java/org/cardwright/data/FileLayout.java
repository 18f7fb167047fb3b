package org.cardwright.data;

/** How a measurement file records its points, told apart by its header row. */
public enum FileLayout {
    /** One measured point per row: columns V and I (I-V) or V and C (C-V). */
    POINT_TABLE,
    /**
     * A supply, a series resistor and a meter across the diode, one setting per row: columns Vsupply, Rseries
     * and Vmeter. The reader turns each row into an I-V point by Kirchhoff's current law at the diode node.
     */
    SERIES_RESISTOR_LOG
}
