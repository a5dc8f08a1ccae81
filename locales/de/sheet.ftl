# transit-parallax: Meldungen (sheet) auf Deutsch. DURCHSICHT NÖTIG: braucht die Durchsicht durch Muttersprachler (translations want a native speaker's review).
