# transit-parallax : messages (results) en français. RELECTURE NÉCESSAIRE : elle demande la relecture d'un locuteur natif (translations want a native speaker's review).
