package org.lagmill.forecast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.LocalDate;
import java.util.HexFormat;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSpec;
import org.lagmill.ingest.IngestOptions;
import org.lagmill.ingest.SalesInputs;
import org.lagmill.ingest.SalesInputs.SideFile;
import org.lagmill.ingest.StoreIngest;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreGenerations;

/**
 * A daily run keeps its behaviour byte for byte while the store learns other periods: a fixed daily data set (sales
 * with unknown days and pre-launch zeros, a calendar with a global and a keyed column, prices past the last day) is
 * ingested, its training features streamed and a direct forecast written with a fixed linear predictor. The SHA-256
 * checksums below were recorded by running this test on main's code before stores recorded a period (main at
 * "One key matcher for dated per-key files: PriceKeys becomes SeriesKeys"). Its price file repeats no price, so the
 * store is also the one main wrote before repeated prices were collapsed. A change that alters daily store bytes,
 * daily features or daily forecast files on purpose must say so and record new checksums here.
 */
class DailyRunGoldenTest {
  /** Fixed, not the master seed: the checksums belong to this one data set. */
  private static final long DATA_SEED = 0x60_1D_E7L;
  private static final LocalDate FIRST = LocalDate.of(2024, 1, 1);
  private static final int SERIES = 12;
  private static final int DAYS = 150;
  private static final int HORIZON = 14;

  private static final String STORE_SHA = "ebb94069b6a3537abc78c3b4220e0fbbe4c39d435cfdecf940c3480e5007b7f0";
  private static final String FEATURES_SHA = "00d0c90624b7083fe0a36bba7b7be9fb41337605a4c342e00d74be6035632ad1";
  private static final String FORECAST_SHA = "08422319c622d8c716067c467c09ea884dfaa17888266b6cc12c82ec4fb81414";

  @TempDir
  Path temp;

  @Test
  void shouldKeepDailyStoreFeaturesAndForecastByteIdentical() throws Exception {
    Path sales = temp.resolve("sales.csv");
    Path calendar = temp.resolve("calendar.csv");
    Path prices = temp.resolve("prices.csv");
    writeData(sales, calendar, prices);
    Path storeDir = temp.resolve("store");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions
          .of(SalesInputs.of(sales).with(SideFile.CALENDAR, calendar).with(SideFile.PRICES, prices), storeDir), budget);
      MessageDigest store = MessageDigest.getInstance("SHA-256");
      for (String name : List.of("units.bin", "series.bin", "attributes.bin", "prices.bin", "calendar.bin")) {
        store.update(Files.readAllBytes(StoreGenerations.readableDir(storeDir).resolve(name)));
      }
      try (SalesStore history = SalesStore.open(storeDir, budget)) {
        FeatureSpec spec = spec();
        MessageDigest features = MessageDigest.getInstance("SHA-256");
        FeaturePass pass = FeaturePass.training(history, spec);
        features.update(String.join(",", pass.schema().names()).getBytes(java.nio.charset.StandardCharsets.UTF_8));
        ByteBuffer row = ByteBuffer.allocate(4 * (pass.schema().featureCount() + 4)).order(ByteOrder.LITTLE_ENDIAN);
        try (FeatureBatch batch = new FeatureBatch(budget, 512, pass.schema().featureCount())) {
          pass.stream(batch, b -> {
            for (int r = 0; r < b.rowCount(); r++) {
              row.clear();
              row.putInt(b.seriesIndexes()[r]).putInt(b.dayIndexes()[r]).putFloat(b.labels()[r])
                  .putFloat(b.weights()[r]);
              for (int f = 0; f < b.featureCount(); f++) {
                row.putFloat(b.get(r, f));
              }
              features.update(row.array());
            }
          });
        }
        double[][] point = new double[history.seriesCount()][HORIZON];
        BatchPredictor linear = (batch, out) -> {
          for (int r = 0; r < batch.rowCount(); r++) {
            double sum = 0.25;
            for (int f = 0; f < batch.featureCount(); f++) {
              float value = batch.get(r, f);
              sum += Float.isNaN(value) ? 0 : 0.01 * ((f % 5) - 1) * value;
            }
            out[r] = Math.max(0, sum);
          }
        };
        Forecaster.forecast(history, spec, linear, null, HORIZON, budget, point);
        Path forecast = temp.resolve("forecast.csv");
        ForecastFileWriter.writeLong(new ForecastTable(history.dayCount(), point, new double[0], new double[0][][]),
            history, forecast);
        long distinct = Files.readAllLines(forecast).stream().skip(1).map(l -> l.substring(l.lastIndexOf(',')))
            .distinct().count();
        assertTrue(distinct > 10, "a forecast of few distinct values would hide a change: " + distinct);
        assertEquals(List.of(STORE_SHA, FEATURES_SHA, FORECAST_SHA), List.of(hex(store), hex(features),
            hex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(forecast)))),
            "store files, training features, forecast file");
      }
    }
  }

  private static String hex(MessageDigest digest) {
    return hex(digest.digest());
  }

  private static String hex(byte[] bytes) {
    return HexFormat.of().formatHex(bytes);
  }

  /** Every option spelled out, so a change of defaults elsewhere does not move the checksums. */
  private static FeatureSpec spec() {
    return FeatureSpec.builder().horizonDays(HORIZON).strategy(FeatureSpec.Strategy.DIRECT).lagDays(14, 21, 28)
        .rollingWindowDays(7, 28).rollingShiftDays(14).rollingStatNames(List.of("mean", "std"))
        .calendarFeatureNames(List.of("day_of_week", "day_of_month", "month", "week_of_year", "day_of_year"))
        .calendarColumns(true)
        .priceFeatureNames(List.of("price", "price_to_mean", "price_to_max", "price_change_7", "promo",
            "price_to_group"))
        .priceGroupAttributes(List.of("store")).categoricalAttributes(List.of("item", "store"))
        .seriesFeatures(List.of()).build();
  }

  private static void writeData(Path sales, Path calendar, Path prices) throws Exception {
    SplittableRandom random = new SplittableRandom(DATA_SEED);
    StringBuilder s = new StringBuilder("item,store");
    for (int d = 0; d < DAYS; d++) {
      s.append(',').append(FIRST.plusDays(d));
    }
    s.append('\n');
    StringBuilder p = new StringBuilder("item,store,from,price\n");
    for (int i = 0; i < SERIES; i++) {
      String item = "sku" + (i / 3);
      String shop = "shop" + (i % 3);
      s.append(item).append(',').append(shop);
      int launch = i % 4 == 1 ? 20 + random.nextInt(40) : 0;
      double rate = 0.5 + random.nextDouble() * 5;
      for (int d = 0; d < DAYS; d++) {
        s.append(',');
        if (random.nextInt(30) == 0) {
          continue;
        }
        int units = 0;
        if (d >= launch) {
          double mean = rate * (d % 7 >= 5 ? 1.5 : 1.0);
          double l = Math.exp(-mean);
          double prod = random.nextDouble();
          while (prod > l) {
            units++;
            prod *= random.nextDouble();
          }
        }
        s.append(units);
      }
      s.append('\n');
      // Every row changes the price (regular and promotional in turn), so the file holds no repeat for the store to
      // collapse: its bytes are the same whether or not repeats are collapsed.
      double base = 1 + random.nextInt(300) / 100.0;
      boolean promoted = false;
      for (int d = -5 + random.nextInt(10); d < DAYS + HORIZON; d += 10 + random.nextInt(30)) {
        p.append(item).append(',').append(shop).append(',').append(FIRST.plusDays(d)).append(',')
            .append(String.format(java.util.Locale.ROOT, "%.2f", promoted ? base * 0.8 : base)).append('\n');
        promoted = !promoted;
      }
    }
    StringBuilder c = new StringBuilder("date,fair,holiday[store=shop1]\n");
    for (int d = 0; d < DAYS + HORIZON; d++) {
      c.append(FIRST.plusDays(d)).append(',').append(random.nextInt(15) == 0 ? "spring" : "").append(',')
          .append(d % 9 == 0 ? 1 : 0).append('\n');
    }
    Files.writeString(sales, s);
    Files.writeString(prices, p);
    Files.writeString(calendar, c);
  }
}
