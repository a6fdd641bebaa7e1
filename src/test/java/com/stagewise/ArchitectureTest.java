package com.stagewise;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.Architectures.layeredArchitecture;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.stagewise.ui.drawing.SchematicPicture;
import com.tngtech.archunit.base.DescribedPredicate;
import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.domain.JavaMethodCall;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Keeps the feature packages of the design notes: dependencies point one way, {@code circuit <-
 * solver <- diagnosis <- history <- interchange <- casework <- report, ui, cli, app}, the screens
 * and the command line change the history only through the case workflow, and each technology stays
 * at its edge (JavaFX in ui/app, JDBC in history, Jackson in interchange, PDFBox in report).
 */
class ArchitectureTest {
  private static JavaClasses classes;

  @BeforeAll
  static void importMainClasses() {
    classes =
        new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("com.stagewise");
  }

  @Test
  void javafx_onlyInUiAndApp() {
    noClasses()
        .that()
        .resideOutsideOfPackages("com.stagewise.ui..", "com.stagewise.app..")
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage("javafx..")
        .check(classes);
  }

  /**
   * View models (every {@code *Model} class of the UI, the bench state in the ui root package, and
   * the words) stay plain Java: properties and commands, never nodes, so that they are tested
   * without the toolkit (issue 8).
   */
  @Test
  void viewModels_importNoJavafxScene() {
    noClasses()
        .that()
        .resideInAPackage("com.stagewise.ui..")
        .and()
        .haveSimpleNameEndingWith("Model")
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage("javafx.scene..")
        .check(classes);
    noClasses()
        .that()
        .resideInAnyPackage("com.stagewise.ui", "com.stagewise.ui.words..")
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage("javafx.scene..")
        .check(classes);
  }

  /** The rule above looks at real classes: the screens' view models are among them. */
  @Test
  void viewModelRule_seesTheScreensViewModels() {
    long viewModels =
        classes.stream()
            .filter(c -> c.getPackageName().startsWith("com.stagewise.ui."))
            .filter(c -> c.getSimpleName().endsWith("ViewModel"))
            .count();
    org.junit.jupiter.api.Assertions.assertTrue(
        viewModels >= 6, "expected the six screens' view models, found " + viewModels);
  }

  /**
   * The store contract knows no store: {@code history} and its records depend on neither the SQLite
   * nor the PostgreSQL store, which both depend on it (issue 8: no cycle between the history's
   * packages). Callers open a store by its own class.
   */
  @Test
  void storeContract_knowsNoStoreImplementation() {
    noClasses()
        .that()
        .resideInAnyPackage("com.stagewise.history", "com.stagewise.history.record..")
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage(
            "com.stagewise.history.jdbc..",
            "com.stagewise.history.sqlite..",
            "com.stagewise.history.postgres..")
        .check(classes);
  }

  /**
   * No package of the program, at any depth, is part of a dependency cycle. One pair is taken as a
   * whole: {@code circuit.value} (value parsing and formatting) raises the circuit's {@code
   * InvalidInputException} and reads the {@code MeterSpec}, and the circuit's limits format their
   * values with it; they are one feature in two folders.
   */
  @Test
  void packages_areFreeOfCycles() {
    slices()
        .matching("com.stagewise.(**)")
        .should()
        .beFreeOfCycles()
        .ignoreDependency(
            JavaClass.Predicates.resideInAPackage("com.stagewise.circuit.value"),
            JavaClass.Predicates.resideInAPackage("com.stagewise.circuit"))
        .check(classes);
  }

  @Test
  void jdbc_onlyInTheStoreImplementations() {
    // The store contract (com.stagewise.history) is free of JDBC, so that every store can pass it;
    // the two stores (the bench's SQLite file, the shop server on PostgreSQL) and the part they
    // share (history.jdbc) hold all of it.
    noClasses()
        .that()
        .resideOutsideOfPackages(
            "com.stagewise.history.jdbc..",
            "com.stagewise.history.sqlite..",
            "com.stagewise.history.postgres..")
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage("java.sql..")
        .check(classes);
  }

  @Test
  void jackson_onlyInInterchange() {
    noClasses()
        .that()
        .resideOutsideOfPackage("com.stagewise.interchange..")
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage("com.fasterxml.jackson..")
        .check(classes);
  }

  @Test
  void pdfbox_onlyInReport() {
    noClasses()
        .that()
        .resideOutsideOfPackage("com.stagewise.report..")
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage("org.apache.pdfbox..", "org.apache.fontbox..")
        .check(classes);
  }

  /**
   * DESIGN.md, Architecture: {@code circuit <- solver <- diagnosis <- history <- interchange <-
   * casework <- report, ui, cli, app}.
   */
  @Test
  void featurePackages_dependOneWay() {
    layeredArchitecture()
        .consideringOnlyDependenciesInLayers()
        .withOptionalLayers(true)
        .layer("circuit")
        .definedBy("com.stagewise.circuit..")
        .layer("solver")
        .definedBy("com.stagewise.solver..")
        .layer("diagnosis")
        .definedBy("com.stagewise.diagnosis..")
        .layer("history")
        .definedBy("com.stagewise.history..")
        .layer("interchange")
        .definedBy("com.stagewise.interchange..")
        .layer("casework")
        .definedBy("com.stagewise.casework..")
        .layer("report")
        .definedBy("com.stagewise.report..")
        .layer("ui")
        .definedBy("com.stagewise.ui..")
        .layer("cli")
        .definedBy("com.stagewise.cli..")
        .layer("app")
        .definedBy("com.stagewise.app..")
        .whereLayer("circuit")
        .mayNotAccessAnyLayer()
        .whereLayer("solver")
        .mayOnlyAccessLayers("circuit")
        .whereLayer("diagnosis")
        .mayOnlyAccessLayers("solver", "circuit")
        .whereLayer("history")
        .mayOnlyAccessLayers("diagnosis", "solver", "circuit")
        .whereLayer("interchange")
        .mayOnlyAccessLayers("history", "diagnosis", "solver", "circuit")
        .whereLayer("casework")
        .mayOnlyAccessLayers("interchange", "history", "diagnosis", "solver", "circuit")
        .whereLayer("casework")
        .mayOnlyBeAccessedByLayers("report", "ui", "cli", "app")
        .whereLayer("report")
        .mayOnlyAccessLayers("casework", "interchange", "history", "diagnosis", "solver", "circuit")
        .whereLayer("report")
        .mayOnlyBeAccessedByLayers("ui", "cli", "app")
        .whereLayer("ui")
        .mayOnlyAccessLayers(
            "report", "casework", "interchange", "history", "diagnosis", "solver", "circuit")
        .whereLayer("cli")
        .mayOnlyAccessLayers(
            "ui", "report", "casework", "interchange", "history", "diagnosis", "solver", "circuit")
        .whereLayer("app")
        .mayOnlyAccessLayers(
            "ui",
            "cli",
            "report",
            "casework",
            "interchange",
            "history",
            "diagnosis",
            "solver",
            "circuit")
        .check(classes);
  }

  /**
   * The history's methods that change it (store interface and method name), and the fillers that
   * write whole data sets. Reading (finding, listing, searching, exporting, backing up) is not in
   * the list.
   */
  private static final Set<String> HISTORY_WRITES =
      Set.of(
          "Units.boardModel",
          "Units.add",
          "Units.addWithModel",
          "Cases.open",
          "Cases.close",
          "Cases.addReadings",
          "Cases.addNote",
          "Cases.addAction",
          "Cases.attachPhoto",
          "Cases.addAfterRepair",
          "StageLibrary.add",
          "StageLibrary.save",
          "StageLibrary.useForCase",
          "StageLibrary.addBoardModel",
          "Transfer.importBundle",
          "Transfer.restoreFrom",
          "DemoHistory.fill",
          "SyntheticHistory.fill");

  private static final DescribedPredicate<JavaMethodCall> A_HISTORY_WRITE =
      DescribedPredicate.describe(
          "a method that changes the history",
          call ->
              call.getTargetOwner().getPackageName().startsWith("com.stagewise.history")
                  && HISTORY_WRITES.contains(
                      call.getTargetOwner().getSimpleName() + "." + call.getName()));

  /**
   * Issue 8: the case workflow is the only way the screens and the command line change a case (or
   * anything else in the history); they may read from the history directly.
   */
  @Test
  void uiAndCli_changeTheHistoryOnlyThroughCasework() {
    noClasses()
        .that()
        .resideInAnyPackage("com.stagewise.ui..", "com.stagewise.cli..")
        .should()
        .callMethodWhere(A_HISTORY_WRITE)
        .check(classes);
  }

  /** The rule above looks at real calls: the case workflow makes most of the listed writes. */
  @Test
  void historyWriteRule_seesTheCaseworkWrites() {
    Set<String> made = new java.util.TreeSet<>();
    for (JavaClass c : classes) {
      if (c.getPackageName().startsWith("com.stagewise.casework")) {
        for (JavaMethodCall call : c.getMethodCallsFromSelf()) {
          if (A_HISTORY_WRITE.test(call)) {
            made.add(call.getTargetOwner().getSimpleName() + "." + call.getName());
          }
        }
      }
    }
    org.assertj.core.api.Assertions.assertThat(made)
        .contains(
            "Units.addWithModel",
            "Cases.open",
            "Cases.close",
            "Cases.addReadings",
            "Cases.addNote",
            "Cases.addAction",
            "Cases.attachPhoto",
            "Cases.addAfterRepair",
            // A stage joins the library as a version of its stage, saved or used for a case.
            "StageLibrary.save",
            "StageLibrary.useForCase",
            "StageLibrary.addBoardModel",
            "Transfer.importBundle",
            "Transfer.restoreFrom",
            "DemoHistory.fill");
  }

  /**
   * The command line draws schematics with the app's plain-Java picture writer ({@code stage
   * draw}); nothing else of the ui package is its business.
   */
  @Test
  void cli_usesOfTheUiOnlyTheSchematicPicture() {
    noClasses()
        .that()
        .resideInAPackage("com.stagewise.cli..")
        .should()
        .dependOnClassesThat(
            JavaClass.Predicates.resideInAPackage("com.stagewise.ui..")
                .and(
                    DescribedPredicate.not(
                        JavaClass.Predicates.equivalentTo(SchematicPicture.class))))
        .check(classes);
  }

  @Test
  void everyClass_sitsInAFeaturePackage() {
    noClasses()
        .should()
        .resideOutsideOfPackages(
            "com.stagewise.circuit..",
            "com.stagewise.solver..",
            "com.stagewise.diagnosis..",
            "com.stagewise.history..",
            "com.stagewise.interchange..",
            "com.stagewise.casework..",
            "com.stagewise.report..",
            "com.stagewise.ui..",
            "com.stagewise.cli..",
            "com.stagewise.app..")
        .check(classes);
  }
}
