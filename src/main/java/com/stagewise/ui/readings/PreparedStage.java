package com.stagewise.ui.readings;

import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.solver.ExpectedAc;
import com.stagewise.solver.ExpectedVolts;

/**
 * What the readings screen works out in the background when a stage arrives on the bench.
 *
 * @param stage the stage it was worked out for
 * @param volts what a healthy stage reads in DC
 * @param signal what a healthy stage reads in AC (may be null)
 * @param diagnoser the diagnosis of the stage
 * @param diagnosis the diagnosis of the readings on the bench, or null when there are none
 */
record PreparedStage(
    Stage stage,
    ExpectedVolts volts,
    ExpectedAc signal,
    Diagnoser diagnoser,
    Diagnosis diagnosis) {}
