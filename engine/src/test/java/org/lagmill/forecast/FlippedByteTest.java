package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.PlanSource;
import org.lagmill.ingest.SalesInputs;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.io.CorruptFileException;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.progress.ProgressListener;
import org.lagmill.report.ReportData;
import org.lagmill.report.ReportJson;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreGenerations;
import org.lagmill.store.StoreManifest;
import org.lagmill.training.ModelDirectory;
import org.lagmill.training.ModelSet;
import org.lagmill.training.ModelTraining;
import org.lagmill.training.SmallHistories;
import org.lagmill.training.TrainingPlan;

/**
 * A byte flipped anywhere in any file lagmill writes and later reads is caught on open: every store file (each file
 * its manifest lists, closures and plan included, the manifest, the pointer), every model file (the LightGBM text,
 * the manifest, the dispersion table) and a run's report.json. Each file is tried at its first, middle and last byte and at seeded random positions.
 */
@org.junit.jupiter.api.Tag("reliability")
class FlippedByteTest {
  private static final Path TINY = Path.of("..", "testdata", "tiny");
  private static final long SEED = Long.getLong("lagmill.seed", 9_107L);
  private static final int RANDOM_POSITIONS = 4;

  @TempDir
  static Path fixture;
  private static Path store;
  private static Path model;
  private static Path report;
  private static ArraySalesHistory history;

  @BeforeAll
  static void writeOneOfEach() throws IOException {
    store = fixture.resolve("store");
    model = fixture.resolve("model");
    report = fixture.resolve("report.json");
    history = SmallHistories.history(SEED, 6, 90, 7);
    TrainingPlan plan = SmallHistories.plan(SmallHistories.spec(7), 2, 89, 7, null);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      // closures and a plan too, so the store holds a file of every kind
      Path closures = Files.writeString(fixture.resolve("closures.csv"), "store,from,until\nNV-01,2026-01-10,"
          + "2026-01-11\n");
      Path planFile = Files.writeString(fixture.resolve("plan.csv"), "item,from,promo\nPNT-D1-0001,2026-01-05,1\n");
      StoreIngest.ingest(IngestOptions.of(SalesInputs.of(TINY.resolve("sales.csv"))
          .with(SideFile.CALENDAR, TINY.resolve(
              "calendar.csv"))
          .with(SideFile.PRICES, TINY.resolve("prices.csv")).with(SideFile.CLOSURES, closures)
          .withPlan(PlanSource.of(planFile)), store), budget);
      try (ModelSet trained = ModelTraining.train(history, plan, budget, ProgressListener.SILENT)) {
        ModelDirectory.save(trained, model, history, plan, "fp");
      }
    }
    ReportJson.write(ReportData.builder("flip").build(), report);
  }

  static Stream<Arguments> files() throws IOException {
    Path generation = StoreGenerations.readableDir(store);
    List<Arguments> cases = new ArrayList<>();
    List<String> names = new ArrayList<>();
    for (StoreManifest.StoreFile file : StoreManifest.read(generation).files()) {
      names.add(file.name());
    }
    assertTrue(names.containsAll(List.of("units.bin", "series.bin", "attributes.bin", "prices.bin", "calendar.bin",
        "closures.bin", "plan.bin")), "the fixture store holds every kind of file: " + names);
    names.add(StoreManifest.FILE_NAME);
    for (String name : names) {
      cases.add(Arguments.of("store " + name, generation.resolve(name), (Opener) () -> openStore()));
    }
    cases.add(Arguments.of("store pointer", store.resolve(StoreGenerations.POINTER_FILE_NAME),
        (Opener) () -> openStore()));
    for (String name : List.of("model.txt", "manifest.json", "dispersion.csv")) {
      cases.add(Arguments.of("model " + name, model.resolve(name), (Opener) () -> ModelDirectory.open(model, history)
          .close()));
    }
    cases.add(Arguments.of("report.json", report, (Opener) () -> ReportJson.read(report)));
    return cases.stream();
  }

  private static void openStore() throws IOException {
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        SalesStore opened = SalesStore.open(store, budget)) {
      opened.seriesCount();
    }
  }

  /** Opens what the flipped file belongs to, as a later command would. */
  @FunctionalInterface
  interface Opener {
    void open() throws IOException;
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("files")
  void shouldDetectAByteFlippedAnywhere(String kind, Path file, Opener opener) throws IOException {
    byte[] original = Files.readAllBytes(file);
    Random random = new Random(SEED ^ kind.hashCode());
    List<Integer> positions = new ArrayList<>(List.of(0, original.length / 2, original.length - 1));
    for (int i = 0; i < RANDOM_POSITIONS; i++) {
      positions.add(random.nextInt(original.length));
    }
    try {
      for (int position : positions) {
        byte[] flipped = original.clone();
        flipped[position] ^= (byte) (1 << random.nextInt(8));
        Files.write(file, flipped);
        CorruptFileException e = assertThrows(CorruptFileException.class, opener::open,
            kind + ": byte " + position + " flipped, seed " + SEED);
        assertTrue(e.getMessage().startsWith(file.getParent().toString()), e.getMessage());
      }
    } finally {
      Files.write(file, original);
    }
    opener.open();
  }
}
