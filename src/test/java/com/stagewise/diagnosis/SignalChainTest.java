package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import java.nio.file.Path;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SignalChainTest {
  private static final Stage CHAIN =
      StageSheet.read(Path.of("data/stages/tarnwell-ps4-channel-chain.stage.json"));

  @Test
  void chain_sectionsInSignalOrder() {
    // The sheet's topology: IN -> U1A (x2) -> U1B (-2.2) -> U1C (-1) -> U1D (-1.5) -> U2A (x2).
    assertThat(SignalChain.of(CHAIN).sections()).containsExactly("U1A", "U1B", "U1C", "U1D", "U2A");
  }

  @Test
  void instrumentationAmplifier_inputBuffersComeBeforeTheDifferenceSection() {
    Stage stage = Templates.named("instrumentation").build();
    // Textbook three-op-amp instrumentation amplifier: two input buffers (U1A, U1B) feed the
    // difference amplifier (U1C, output OUT).
    assertThat(SignalChain.of(stage).sections()).containsExactly("U1A", "U1B", "U1C");
  }

  @ParameterizedTest
  @CsvSource({
    "R2:open, U1A",
    "R1:low, U1A",
    "R3:high, U1B",
    "C1:short, U1B",
    "R6:open, U1C",
    "R8:open, U1D",
    "R11:open, U2A",
    "R12:short, U2A",
    "U1C:stuck-high, U1C",
    // DESIGN.md quad-14 pinout: pin 9 is in-3 (section C), pin 13 is in-4 (section D).
    "U1.9:lifted, U1C",
    "U1.13-14:bridge, U1D",
    "U2.2:lifted, U2A"
  })
  void fault_sitsAtItsSection(String id, String section) {
    Fault fault = Fault.parse(id, Set.of("VCC", "VEE"));
    assertThat(SignalChain.of(CHAIN).section(fault)).contains(section);
  }

  @ParameterizedTest
  @CsvSource({"VCC:missing", "VEE:low", "U1.4:lifted", "U1.11:lifted", "healthy"})
  void supplyFaults_belongToNoOneSection(String id) {
    Fault fault = Fault.parse(id, Set.of("VCC", "VEE"));
    assertThat(SignalChain.of(CHAIN).position(fault)).isEqualTo(Optional.empty());
  }
}
