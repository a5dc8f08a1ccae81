# transit-parallax: feedback messages in English (the reference: every message here must exist in every language's file, with the same variables).
