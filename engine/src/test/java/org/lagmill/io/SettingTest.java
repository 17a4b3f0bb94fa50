package org.lagmill.io;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** Engine text names settings and commands by mentions; a front end's names replace them, unknown ones stay. */
class SettingTest {
  @Test
  void shouldMentionSettingsAndCommandsByTheirNeutralKeys() {
    assertEquals("\u2039plan-carry-forward\u203a", Setting.PLAN_CARRY_FORWARD.toString());
    assertEquals("\u2039append command\u203a", Setting.Command.APPEND.toString());
    assertEquals("append", Setting.Command.APPEND.key());
  }

  @Test
  void shouldReplaceEachMentionByTheFrontEndsNameAndKeepUnknownOnes() {
    String text = "append a plan (" + Setting.Command.APPEND + " " + Setting.STORE + " DIR " + Setting.PLAN
        + " FILE), not \u2039nothing\u203a nor \u2039nothing command\u203a";
    assertEquals("append a plan (run:append /store DIR /plan FILE), not \u2039nothing\u203a nor "
        + "\u2039nothing command\u203a", Setting.render(text, s -> "/" + s.key(), c -> "run:" + c.key()));
  }
}
